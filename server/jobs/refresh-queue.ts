// Rebuilds the work queue from the state of every string, report and certificate. Safe to run at
// any time (open items are keyed, so nothing is opened twice); npm start runs it every 10 minutes.
import type { Db } from '../db'
import { openItem, syncStringQueue } from '../services/queue-sync'
import { refreshForecasts } from './refresh-forecasts'

const DAY = 86_400_000
/** Certificates come into the queue this many days before they fall due (common practice, no source). */
export const CERTIFICATE_LEAD_DAYS = 14
/** Forecast risk that opens an item: the string may go dark within 72 burning hours. */
export const FORECAST_DARK_P72 = 0.25

export async function refreshQueue(db: Db, now = new Date()) {
  const before = Number((await db('queueItems').where('state', 'open').count({ n: '*' }))[0].n)
  // Wake snoozed items whose time has come.
  await db('queueItems')
    .where('state', 'snoozed')
    .where('snoozedUntil', '<=', now)
    .update({ state: 'open', snoozedUntil: null })

  const strings = await db('strings').whereIn('status', ['replace', 'dark']).select('id')
  for (const s of strings) await syncStringQueue(db, s.id, null, now)

  const risky = await refreshForecasts(db, now)
  for (const r of risky) {
    // Dark, made-safe and replace-now strings are in the queue already under their own kind.
    if (r.pDark72 < FORECAST_DARK_P72 || (r.status !== 'lit' && r.status !== 'watch')) continue
    await openItem(
      db,
      {
        kind: 'forecast_dark',
        subject: `string:${r.id}`,
        severity: 'standard',
        stringId: r.id,
        siteId: r.siteId,
        clientId: r.clientId,
        summary: `${r.assetTag} may go dark within 3 nights (${Math.round(r.pDark72 * 100)} %)`,
      },
      now,
    )
  }

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
      's.siteId',
      'si.clientId',
    )
  const defaultClient = (await db('clients').orderBy('id').first('id'))?.id ?? null
  for (const r of reports) {
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
        summary: `${r.ref}: ${r.hazard ? 'hazard reported' : 'fault reported'} on ${r.streetText ?? 'unknown street'}`,
      },
      now,
    )
  }
  await db('queueItems')
    .where('kind', 'public_report')
    .whereIn('state', ['open', 'snoozed'])
    .whereIn('reportId', db('reports').whereNotIn('state', ['received', 'in_hand']).select('id'))
    .update({ state: 'closed', openKey: null, closedAt: now })

  // The newest certificate of each kind per subject decides whether something is due.
  const certs = await db('certificates as c')
    .whereRaw(
      'c.id = (select max(c2.id) from certificates c2 where c2.kind = c.kind and c2.subject_type = c.subject_type and c2.subject_id = c.subject_id)',
    )
    .select('c.id', 'c.kind', 'c.subjectType', 'c.subjectId', 'c.reference', 'c.nextDue', 'c.result')
  const soon = new Date(now.getTime() + CERTIFICATE_LEAD_DAYS * DAY).toISOString().slice(0, 10)
  const places = await certificatePlaces(db)
  for (const c of certs) {
    const place = places.get(`${c.subjectType}:${c.subjectId}`) ?? { siteId: null, clientId: defaultClient }
    if (c.kind === 'rcd_test' && c.result === 'fail') {
      await openItem(
        db,
        {
          kind: 'rcd_failed',
          subject: `certificate:${c.id}`,
          severity: 'emergency',
          certificateId: c.id,
          ...place,
          summary: `RCD test failed: ${c.reference ?? c.subjectType + ' ' + c.subjectId}`,
        },
        now,
      )
    } else if (c.nextDue && c.nextDue <= soon) {
      await openItem(
        db,
        {
          kind: 'certificate_due',
          subject: `certificate:${c.kind}:${c.subjectType}:${c.subjectId}`,
          severity: 'standard',
          certificateId: c.id,
          ...place,
          dueBy: new Date(`${c.nextDue}T23:59:00Z`),
          summary: `${c.reference ?? c.kind} due ${c.nextDue}`,
        },
        now,
      )
    }
  }
  const after = Number((await db('queueItems').where('state', 'open').count({ n: '*' }))[0].n)
  return { opened: Math.max(0, after - before), open: after }
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
