// Certificates in the queue: the newest record per subject and kind opens an item when it falls due
// within the lead time or records a failed RCD test; a newer record that settles it closes the item.
import { closeItems, openItem, ACTIVE } from './items'
import type { Db } from '../../db'
import { isoDay } from '../../../shared/iso-time'
import { endOfLocalDay } from '../../../shared/local-time'
import { clientZones } from '../zones'
import { config } from '../../config'

const DAY = 86_400_000
/** Certificates come into the queue this many days before they fall due (common practice, no source). */
export const CERTIFICATE_LEAD_DAYS = 14

export async function syncCertificateItems(db: Db, now = new Date()) {
  const certs = await db('certificates as c')
    .whereRaw(
      'c.id = (select max(c2.id) from certificates c2 where c2.kind = c.kind and c2.subject_type = c.subject_type and c2.subject_id = c.subject_id)',
    )
    .select('c.id', 'c.kind', 'c.subjectType', 'c.subjectId', 'c.reference', 'c.nextDue', 'c.result')
  const soon = isoDay(now.getTime() + CERTIFICATE_LEAD_DAYS * DAY)
  const places = await certificatePlaces(db)
  const zones = await clientZones(db)
  const wanted = new Set<string>()
  for (const c of certs) {
    const place = places.get(`${c.subjectType}:${c.subjectId}`) ?? { siteId: null, clientId: null }
    const label = c.reference ?? `${c.subjectType} ${c.subjectId}`
    if (c.kind === 'rcd_test' && c.result === 'fail') {
      const subject = `circuit-rcd:${c.subjectId}`
      wanted.add(`rcd_failed:${subject}`)
      await openItem(
        db,
        {
          kind: 'rcd_failed',
          subject,
          severity: 'emergency',
          certificateId: c.id,
          ...place,
          summary: `RCD test failed: ${label}`,
        },
        now,
      )
    } else if (c.nextDue && c.nextDue <= soon) {
      const subject = `certificate:${c.kind}:${c.subjectType}:${c.subjectId}`
      wanted.add(`certificate_due:${subject}`)
      await openItem(
        db,
        {
          kind: 'certificate_due',
          subject,
          severity: 'standard',
          certificateId: c.id,
          ...place,
          // Due "on" a date: the end of that day on the client's clock.
          dueBy: endOfLocalDay(
            c.nextDue,
            (place.clientId && zones.get(place.clientId)) || config.APP_TIME_ZONE,
          ),
          summary: `${label} due ${c.nextDue}`,
        },
        now,
      )
    }
  }
  const open = await db('queueItems')
    .whereIn('kind', ['rcd_failed', 'certificate_due'])
    .whereIn('state', ACTIVE)
    .select('id', 'openKey')
  const settled = open.filter((i) => !wanted.has(i.openKey)).map((i) => i.id as number)
  await closeItems(db, settled, { now })
}

/** Where a certificate's subject stands: structures and circuits belong to a site; platforms to none. */
async function certificatePlaces(db: Db) {
  const map = new Map<string, { siteId: number | null; clientId: number | null }>()
  const structures = await db('structures as st')
    .join('sites as si', 'si.id', 'st.siteId')
    .select('st.id', 'si.id as siteId', 'si.clientId')
  for (const s of structures) map.set(`structure:${s.id}`, { siteId: s.siteId, clientId: s.clientId })
  const circuits = await db('circuits as ci')
    .join('supplyPoints as sp', 'sp.id', 'ci.supplyPointId')
    .join('sites as si', 'si.id', 'sp.siteId')
    .select('ci.id', 'si.id as siteId', 'si.clientId')
  for (const c of circuits) map.set(`circuit:${c.id}`, { siteId: c.siteId, clientId: c.clientId })
  return map
}
