// What the contractor shows the client for a period: the register's state, the work done, the
// faults against the contract's response times, public reports and the energy used.
import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import { energyReport } from './energy'
import { isoDay } from '../../shared/iso-time'

const DAY = 86_400_000
/** Queue kinds that are faults the contract's response times apply to (the report and the digest). */
export const FAULT_KINDS = ['replace_now', 'dark', 'public_report', 'rcd_failed'] as const
const num = (v: unknown) => Number(v ?? 0)

export async function clientReport(
  db: Db,
  q: { clientId: number; from?: string; to?: string },
  now = new Date(),
) {
  const c = await db('clients').where({ id: q.clientId }).first()
  if (!c) throw notFound('Client')
  const from = q.from ?? c.seasonStart ?? isoDay(now)
  const to = q.to ?? isoDay(now)
  if (from > to)
    throw badRequest(
      'date_range_reversed',
      `The period starts (${from}) after it ends (${to}): swap the dates.`,
      {
        from,
        to,
      },
    )
  const start = new Date(`${from}T00:00:00Z`)
  const end = new Date(Date.parse(`${to}T00:00:00Z`) + DAY)
  const siteIds = db('sites').where({ clientId: c.id }).select('id')
  const statuses = await db('strings')
    .whereIn('siteId', siteIds)
    .groupBy('status')
    .select('status', db.raw('count(*) as n'))
  const byStatus = Object.fromEntries(
    (statuses as { status: string; n: number }[]).map((s) => [s.status, num(s.n)]),
  )
  const v = await db('visits as v')
    .join('strings as s', 's.id', 'v.stringId')
    .whereIn('s.siteId', siteIds)
    .whereBetween('v.visitedAt', [start, end])
    .first(
      db.raw('count(*) as total'),
      db.raw('sum(v.failed_found) as found'),
      db.raw('sum(v.replaced) as replaced'),
      db.raw('sum(v.fuse_replaced) as fuses'),
      db.raw('sum(v.replaced > 0 or v.fuse_replaced) as relamps'),
      db.raw('sum((v.replaced > 0 or v.fuse_replaced) and v.isolation_id is not null) as isolated'),
    )
  const photos = await db('photos as p')
    .join('visits as v', 'v.id', 'p.visitId')
    .join('strings as s', 's.id', 'v.stringId')
    .whereIn('s.siteId', siteIds)
    .whereBetween('v.visitedAt', [start, end])
    .count({ n: '*' })
  const items = await db('queueItems')
    .where({ clientId: c.id })
    .whereIn('kind', FAULT_KINDS)
    .whereBetween('openedAt', [start, end])
    .select('state', 'openedAt', 'dueBy', 'closedAt')
  const closed = items.filter((i) => i.closedAt && i.state === 'closed')
  const onTime = closed.filter((i) => new Date(i.closedAt) <= new Date(i.dueBy))
  const hours = closed
    .map((i) => (+new Date(i.closedAt) - +new Date(i.openedAt)) / 3_600_000)
    .sort((a, b) => a - b)
  const overdueNow = await db('queueItems')
    .where({ clientId: c.id, state: 'open' })
    .where('dueBy', '<', now)
    .count({ n: '*' })
  const reports = await db('reports as r')
    .leftJoin('strings as s', 's.id', 'r.stringId')
    .leftJoin('sites as si', (j) => j.on('si.id', 's.siteId').orOn('si.name', 'r.streetText'))
    .where('si.clientId', c.id)
    .whereBetween('r.createdAt', [start, end])
    .select('r.state')
  const energy = (await energyReport(db, now)).clients.find((x) => x.id === c.id)!
  const seasonFrom = Math.max(+start, c.seasonStart ? Date.parse(c.seasonStart) : +start)
  const seasonTo = Math.min(+end, c.seasonEnd ? Date.parse(c.seasonEnd) + DAY : +end)
  const nights = Math.max(0, Math.round((seasonTo - seasonFrom) / DAY))
  return {
    client: {
      id: c.id,
      name: c.name,
      contractRef: c.contractRef ?? null,
      emergencyHours: c.responseEmergencyHours,
      standardHours: c.responseStandardHours,
    },
    from,
    to,
    strings: { total: Object.values(byStatus).reduce((a, b) => a + b, 0), byStatus },
    visits: {
      total: num(v?.total),
      lampsFound: num(v?.found),
      lampsReplaced: num(v?.replaced),
      fuseLampsReplaced: num(v?.fuses),
      relamps: num(v?.relamps),
      relampsIsolated: num(v?.isolated),
      photos: num(photos[0].n),
    },
    faults: {
      opened: items.length,
      closed: closed.length,
      closedOnTime: onTime.length,
      onTimeShare: closed.length ? onTime.length / closed.length : null,
      medianHoursToClose: hours.length ? Math.round(hours[Math.floor(hours.length / 2)] * 10) / 10 : null,
      openOverdueNow: num(overdueNow[0].n),
    },
    publicReports: { received: reports.length, fixed: reports.filter((r) => r.state === 'fixed').length },
    energy: { nights, kwh: energy.kwhPerNight * nights, cost: (energy.costPerNight ?? 0) * nights },
  }
}
