// Rebuilds the work queue from the state of every string, report and certificate. Safe to run at
// any time (open items are keyed, so nothing is opened twice); the server runs it every 10 minutes.
import type { Db } from '../db'
import { openItem, syncStringQueue } from '../services/queue-sync'
import { refreshForecasts } from './refresh-forecasts'

const DAY = 86_400_000
/** Certificates come into the queue this many days before they fall due (common practice, no source). */
export const CERTIFICATE_LEAD_DAYS = 14
/** Forecast risk that opens an item: the string may go dark within 72 burning hours. */
export const FORECAST_DARK_P72 = 0.25

const openCount = async (db: Db) =>
  Number((await db('queueItems').where('state', 'open').count({ n: '*' }))[0].n)

export async function refreshQueue(db: Db, now = new Date()) {
  const before = await openCount(db)
  // Wake snoozed items whose time has come.
  await db('queueItems')
    .where('state', 'snoozed')
    .where('snoozedUntil', '<=', now)
    .update({ state: 'open', snoozedUntil: null })
  for (const s of await db('strings').whereIn('status', ['replace', 'dark']).select('id'))
    await syncStringQueue(db, s.id, null, now)
  await refreshForecastItems(db, now)
  await refreshReportItems(db, now)
  await refreshCertificateItems(db, now)
  const after = await openCount(db)
  return { opened: Math.max(0, after - before), open: after }
}

async function refreshForecastItems(db: Db, now: Date) {
  for (const r of await refreshForecasts(db, now)) {
    // Dark, made-safe and replace-now strings are in the queue already under their own kind.
    if (r.pDark72 < FORECAST_DARK_P72 || (r.status !== 'lit' && r.status !== 'watch')) continue
    const nights = Math.round(72 / r.burnHoursPerDay)
    const summary = `${r.assetTag} may go dark within about ${nights} nights (${Math.round(r.pDark72 * 100)} % chance)`
    const base = { stringId: r.id, siteId: r.siteId, clientId: r.clientId }
    await openItem(
      db,
      { ...base, kind: 'forecast_dark', subject: `string:${r.id}`, severity: 'standard', summary },
      now,
    )
  }
}

export async function refreshReportItems(db: Db, now: Date) {
  // A report without a tag is placed by the street the reporter named.
  const reports = await db('reports as r')
    .leftJoin('strings as s', 's.id', 'r.stringId')
    .leftJoin('sites as si', (j) => j.on('si.id', 's.siteId').orOn('si.name', 'r.streetText'))
    .whereIn('r.state', ['received', 'in_hand'])
    .select(
      'r.id',
      'r.ref',
      'r.hazard',
      'r.streetText',
      'r.createdAt',
      'r.stringId',
      'si.id as siteId',
      'si.clientId',
    )
  const defaultClient = (await db('clients').orderBy('id').first('id'))?.id ?? null
  for (const r of reports) {
    const what = r.hazard ? 'hazard reported' : 'fault reported'
    await openItem(
      db,
      {
        kind: 'public_report',
        subject: `report:${r.id}`,
        severity: r.hazard ? 'emergency' : 'standard',
        reportId: r.id,
        stringId: r.stringId ?? null,
        siteId: r.siteId ?? null,
        clientId: r.clientId ?? defaultClient,
        openedAt: new Date(r.createdAt),
        summary: `${r.ref}: ${what} on ${r.streetText ?? 'unknown street'}`,
      },
      now,
    )
  }
  await db('queueItems')
    .where('kind', 'public_report')
    .whereIn('state', ['open', 'snoozed'])
    .whereIn('reportId', db('reports').whereNotIn('state', ['received', 'in_hand']).select('id'))
    .update({ state: 'closed', openKey: null, closedAt: now })
}

/** Opens items for certificates falling due and failed RCD tests; closes those a newer record settled. */
export async function refreshCertificateItems(db: Db, now: Date) {
  const certs = await db('certificates as c')
    .whereRaw(
      'c.id = (select max(c2.id) from certificates c2 where c2.kind = c.kind and c2.subject_type = c.subject_type and c2.subject_id = c.subject_id)',
    )
    .select('c.id', 'c.kind', 'c.subjectType', 'c.subjectId', 'c.reference', 'c.nextDue', 'c.result')
  const soon = new Date(now.getTime() + CERTIFICATE_LEAD_DAYS * DAY).toISOString().slice(0, 10)
  const places = await certificatePlaces(db)
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
          dueBy: new Date(`${c.nextDue}T23:59:00Z`),
          summary: `${label} due ${c.nextDue}`,
        },
        now,
      )
    }
  }
  const open = await db('queueItems')
    .whereIn('kind', ['rcd_failed', 'certificate_due'])
    .whereIn('state', ['open', 'snoozed'])
    .select('id', 'openKey')
  const settled = open.filter((i) => !wanted.has(i.openKey)).map((i) => i.id)
  if (settled.length)
    await db('queueItems').whereIn('id', settled).update({ state: 'closed', openKey: null, closedAt: now })
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
