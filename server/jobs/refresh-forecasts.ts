// Re-forecasts every lit string and stores the median date it goes dark, for the map and the queue; and
// judges the replace-now-by-risk rule (services/replace-risk.ts) on the same forecasts.
import type { Db } from '../db'
import { burnHoursPerDay } from '../../shared/schedule'
import { loadType } from '../services/strings'
import { stringForecastRequest, stringRecordColumns } from '../services/string-engine'
import { forecastManyInPool } from '../workers/heavy-jobs'
import { forecastInstant, localDay } from '../../shared/local-time'
import { config } from '../config'
import type { StringForecastRisk } from '../services/queue/strings'
import {
  applyRiskRule,
  nextPatrolDays,
  patrolSearchFrom,
  riskThreshold,
  riskWindow,
  type RiskOutcome,
} from '../services/replace-risk'

/** Fewer trials than the string page: enough for a queue threshold, fast for a whole town. */
const JOB_TRIALS = 400
const BATCH = 200

/** Strings the risk rule judges: lit or watched ones, and those it flagged before (to clear them). */
const judged = (r: { status: string; replaceRule: string | null }) =>
  r.status === 'lit' || r.status === 'watch' || r.replaceRule === 'risk'

export async function refreshForecasts(db: Db, now = new Date()) {
  const rows = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .whereNotIn('s.status', ['dark', 'safe'])
    .whereNull('s.archivedAt')
    .select(
      ...stringRecordColumns('s'),
      's.assetTag',
      's.status',
      's.replaceRule',
      's.siteId',
      'si.clientId',
      'c.switchOn',
      'c.switchOff',
      'c.timeZone',
      'c.responseStandardHours',
    )
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  const patrols = await nextPatrolDays(
    db,
    rows.filter(judged).map((r) => r.id as number),
    patrolSearchFrom(now),
  )
  // Each client's own calendar: its "today" and the local switch-on time of the forecast date.
  const jobs = []
  for (const r of rows) {
    if (!types.has(r.typeId)) types.set(r.typeId, await loadType(db, r.typeId))
    const zone: string = r.timeZone || config.APP_TIME_ZONE
    const burn = burnHoursPerDay(r.switchOn, r.switchOff)
    const window = judged(r)
      ? riskWindow(now, patrols.get(r.id), {
          switchOn: r.switchOn,
          zone,
          responseStandardHours: r.responseStandardHours,
          burnHoursPerDay: burn,
        })
      : null
    const request = stringForecastRequest(types.get(r.typeId)!, r, {
      burnHoursPerDay: burn,
      startDate: localDay(now, zone),
      now,
      trials: JOB_TRIALS,
      pDarkAt: window && window.burningHours > 0 ? [window.burningHours] : undefined,
    })
    jobs.push({ r, zone, burn, request, window })
  }
  const out: StringForecastRisk[] = []
  const outcomes: RiskOutcome[] = []
  const updates: { id: number; at: Date | null }[] = []
  // The forecasts themselves run on the worker pool, a batch at a time, never on the event loop.
  for (let i = 0; i < jobs.length; i += BATCH) {
    const batch = jobs.slice(i, i + BATCH)
    const results = await forecastManyInPool(batch.map((j) => j.request))
    results.forEach((fc, k) => {
      const { r, zone, burn, window } = batch[k]
      out.push({
        id: r.id,
        assetTag: r.assetTag,
        status: r.status,
        siteId: r.siteId,
        clientId: r.clientId,
        pDark72: fc.pDark72,
        burnHoursPerDay: burn,
      })
      if (window) {
        // No time at risk (a patrol under way) is no chance of going dark before it.
        const at = fc.pDarkAt.find((p) => p.hours === window.burningHours)?.p
        outcomes.push({
          id: r.id,
          status: r.status,
          replaceRule: r.replaceRule ?? null,
          p: window.burningHours > 0 ? (at ?? null) : 0,
          threshold: riskThreshold(types.get(r.typeId)!.replaceRisk),
          window,
        })
      }
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
  // The forecast item is for strings still lit or watched: one the risk rule flagged has its own item.
  const after = await applyRiskRule(db, outcomes, now)
  return out.map((o) => ({ ...o, status: after.get(o.id) ?? o.status }))
}
