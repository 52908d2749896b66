// Certificates in the queue. The newest record per subject and kind counts:
//   - a failed test opens an item at once (a failed RCD test its own emergency kind, a failed
//     insulation test an emergency, any other failed test or examination a standard item);
//   - a certificate coming up to its next due date opens an item 30 days before it, and a fresh one
//     14 days before (the 30-day item closes then), which stays until a newer record settles it.
// A newer record that passes, or moves the due date out, closes the item. Run in the transaction of
// the record that causes it, so the record and its work are one commit.
import { closeItems, openItems, ACTIVE, type OpenItem } from './items'
import type { Db } from '../../db'
import { endOfLocalDay, formatDay, localDay } from '../../../shared/local-time'
import { clientZones } from '../zones'
import { config } from '../../config'
import { subjectIds, subjectLabels, subjectPlaces } from '../certificate-subjects'
import { CERTIFICATE_NOTICE_DAYS } from '../../../shared/schemas/certificates'
import { certificateKindLabel } from '../../../shared/vocab/certificates'

const DAY = 86_400_000
/** Kinds whose failure leaves a live circuit without proven protection: emergency work. */
const EMERGENCY_FAILS = new Set(['insulation_test'])

export interface LatestCertificate {
  id: number
  kind: keyof typeof certificateKindLabel
  subjectType: string
  subjectId: number
  reference: string | null
  doneOn: string
  nextDue: string | null
  result: 'pass' | 'fail' | 'advisory'
}

/** The newest record per subject and kind: the one that counts. */
export function latestCertificates(db: Db): Promise<LatestCertificate[]> {
  return db('certificates as c')
    .whereRaw(
      'c.id = (select max(c2.id) from certificates c2 where c2.kind = c.kind and c2.subject_type = c.subject_type and c2.subject_id = c.subject_id)',
    )
    .select(
      'c.id',
      'c.kind',
      'c.subjectType',
      'c.subjectId',
      'c.reference',
      'c.doneOn',
      'c.nextDue',
      'c.result',
    )
}

/** Whole days from `today` to `day`, both calendar days (negative once past). */
export const daysUntil = (today: string, day: string) =>
  Math.round((Date.parse(`${day}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / DAY)

/** Whether a record may need an item now: failed, or due within the notice period on some clock
 * (a client's day is at most one day off UTC's). The rest need no lookups. */
function mayNeedItem(c: LatestCertificate, utcToday: string): boolean {
  if (c.result === 'fail') return true
  return !!c.nextDue && daysUntil(utcToday, c.nextDue) <= CERTIFICATE_NOTICE_DAYS[0] + 1
}

export async function syncCertificateItems(db: Db, now = new Date()) {
  const certs = (await latestCertificates(db)).filter((c) => mayNeedItem(c, now.toISOString().slice(0, 10)))
  const only = subjectIds(certs)
  const [places, zones, labels] = await Promise.all([
    subjectPlaces(db, only),
    clientZones(db),
    subjectLabels(db, only),
  ])
  // Working out a zone's today is slow: once per zone, not per record.
  const todays = new Map<string, string>()
  const todayIn = (zone: string) => todays.get(zone) ?? todays.set(zone, localDay(now, zone)).get(zone)!
  const items: OpenItem[] = []
  const locale = config.APP_LOCALE
  for (const c of certs) {
    const place = places.get(`${c.subjectType}:${c.subjectId}`) ?? { siteId: null, clientId: null }
    const zone = (place.clientId && zones.get(place.clientId)) || config.APP_TIME_ZONE
    const label =
      labels.get(`${c.subjectType}:${c.subjectId}`) ?? c.reference ?? `${c.subjectType} ${c.subjectId}`
    const what = certificateKindLabel[c.kind] ?? c.kind
    const open = (
      kind: 'rcd_failed' | 'certificate_due',
      subject: string,
      o: Pick<OpenItem, 'severity' | 'summary' | 'dueBy'>,
    ) => items.push({ kind, subject, certificateId: c.id, ...place, ...o })
    if (c.result === 'fail') {
      if (c.kind === 'rcd_test')
        open('rcd_failed', `circuit-rcd:${c.subjectId}`, {
          severity: 'emergency',
          summary: `RCD test failed: ${label}`,
        })
      else
        open('certificate_due', `failed:${c.kind}:${c.subjectType}:${c.subjectId}`, {
          severity: EMERGENCY_FAILS.has(c.kind) ? 'emergency' : 'standard',
          summary: `Failed: ${what}, ${label} (${formatDay(c.doneOn, locale)})`,
        })
      continue
    }
    if (!c.nextDue) continue
    const left = daysUntil(todayIn(zone), c.nextDue)
    if (left > CERTIFICATE_NOTICE_DAYS[0]) continue
    const stage = left <= CERTIFICATE_NOTICE_DAYS[1] ? CERTIFICATE_NOTICE_DAYS[1] : CERTIFICATE_NOTICE_DAYS[0]
    const when = formatDay(c.nextDue, locale)
    open('certificate_due', `${stage}d:${c.kind}:${c.subjectType}:${c.subjectId}`, {
      severity: 'standard',
      // Due "on" a date: the end of that day on the client's clock.
      dueBy: endOfLocalDay(c.nextDue, zone),
      summary: left < 0 ? `${what} expired ${when}: ${label}` : `${what} due ${when}: ${label}`,
    })
  }
  await openItems(db, items, now)
  const wanted = new Set(items.map((i) => `${i.kind}:${i.subject}`))
  const open = await db('queueItems')
    .whereIn('kind', ['rcd_failed', 'certificate_due'])
    .whereIn('state', ACTIVE)
    .select('id', 'openKey')
  const settled = open.filter((i) => !wanted.has(i.openKey)).map((i) => i.id as number)
  await closeItems(db, settled, { now })
}
