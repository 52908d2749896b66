// Re-forecasts every lit string and stores the median date it goes dark, for the map and the queue.
import type { Db } from '../db'
import { burnHoursPerDay } from '../../shared/schedule'
import { loadType } from '../services/strings'
import { stringForecastRequest } from '../services/string-engine'
import { forecastManyInPool } from '../workers/heavy-jobs'
import { forecastInstant, localDay } from '../../shared/local-time'
import { config } from '../config'
import type { StringForecastRisk } from '../services/queue/strings'

/** Fewer trials than the string page: enough for a queue threshold, fast for a whole town. */
const JOB_TRIALS = 400
const BATCH = 200

export async function refreshForecasts(db: Db, now = new Date()) {
  const rows = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .whereNotIn('s.status', ['dark', 'safe'])
    .whereNull('s.archivedAt')
    .select(
      's.id',
      's.assetTag',
      's.typeId',
      's.status',
      's.lampsOut',
      's.fuseFailed',
      's.dark',
      's.isolated',
      's.lampAgeHours',
      's.siteId',
      'si.clientId',
      'c.switchOn',
      'c.switchOff',
      'c.timeZone',
    )
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  // Each client's own calendar: its "today" and the local switch-on time of the forecast date.
  const jobs = []
  for (const r of rows) {
    if (!types.has(r.typeId)) types.set(r.typeId, await loadType(db, r.typeId))
    const zone: string = r.timeZone || config.APP_TIME_ZONE
    const burn = burnHoursPerDay(r.switchOn, r.switchOff)
    const request = stringForecastRequest(types.get(r.typeId)!, r, burn, localDay(now, zone), JOB_TRIALS)
    jobs.push({ r, zone, burn, request })
  }
  const out: StringForecastRisk[] = []
  const updates: { id: number; at: Date | null }[] = []
  // The forecasts themselves run on the worker pool, a batch at a time, never on the event loop.
  for (let i = 0; i < jobs.length; i += BATCH) {
    const batch = jobs.slice(i, i + BATCH)
    const results = await forecastManyInPool(batch.map((j) => j.request))
    results.forEach((fc, k) => {
      const { r, zone, burn } = batch[k]
      out.push({
        id: r.id,
        assetTag: r.assetTag,
        status: r.status,
        siteId: r.siteId,
        clientId: r.clientId,
        pDark72: fc.pDark72,
        burnHoursPerDay: burn,
      })
      updates.push({ id: r.id, at: fc.medianDark ? forecastInstant(fc.medianDark, r.switchOn, zone) : null })
    })
  }
  // One statement per 200 strings rather than one per string.
  for (let i = 0; i < updates.length; i += 200) {
    const chunk = updates.slice(i, i + 200)
    const cases = chunk.map(() => 'when ? then ?').join(' ')
    await db.raw(
      `update strings set forecast_dark_at = case id ${cases} end where id in (${chunk.map(() => '?').join(',')})`,
      [...chunk.flatMap((u) => [u.id, u.at]), ...chunk.map((u) => u.id)],
    )
  }
  return out
}
