// Forecasts the strings whose stored forecast no longer fits (new inputs, too old, or its curve too
// short for the window now judged), keeps each forecast's chance-of-dark curve, and judges the queue's
// forecast rules on the curves: the 72 h forecast item and the replace-now-by-risk rule
// (services/replace-risk.ts). Strings whose inputs have not changed are re-judged from their stored
// curve as time passes, without a new simulation (forecast-curve.ts says how). `full` forecasts all.
import type { Db } from '../db'
import { stringForecastRequest } from '../services/string-engine'
import { forecastManyInPool } from '../workers/heavy-jobs'
import { workerThreads } from '../workers/pool'
import { forecastInstant } from '../../shared/local-time'
import { FORECAST_DARK_P72, type StringForecastRisk } from '../services/queue/strings'
import {
  applyRiskRule,
  nextPatrolDays,
  patrolSearchFrom,
  riskThreshold,
  type RiskOutcome,
} from '../services/replace-risk'
import { typeHashes } from './forecast-key'
import {
  chanceDarkWithin,
  compressCurve,
  curveRequestHours,
  shareDarkBy,
  JOB_TRIALS,
  MAX_FORECAST_AGE_HOURS,
} from './forecast-curve'
import { forecastCandidates, judged, type Candidate } from './forecast-candidates'
import { updateById } from '../services/update-by-id'

const BATCH = 200

export interface RefreshOptions {
  /** Forecast every string again, whatever its key (a periodic safety pass). */
  full?: boolean
}

export interface ForecastRefresh {
  /** The judged strings' 72 h chance, for the forecast items. */
  risks: StringForecastRisk[]
  /** Forecasts simulated in this refresh. */
  forecasts: number
  /** Strings judged from a curve (new or stored). */
  judged: number
  /** Strings whose state the risk rule changed (their items are in step already). */
  flipped: number[]
}

/**
 * Whether the curve must be re-judged at each refresh. Any chance read from it before the forecast is
 * made again is at most F(reach), reach being a day's ageing plus the longest read (the 72 h item, the
 * risk window now, or the client's response time): (F(a + w) − F(a)) / (1 − F(a)) ≤ F(a + w) ≤ F(reach).
 * So a curve whose F(reach) is under both thresholds cannot open an item or flag the string until
 * its next forecast, and is left alone till then.
 */
function watched(c: Candidate, threshold: number): boolean {
  const curve = c.curve!
  const response = (c.row.responseStandardHours * c.burn) / 24
  const reach = (c.burn * MAX_FORECAST_AGE_HOURS) / 24 + Math.max(72, c.window?.burningHours ?? 0, response)
  const top = shareDarkBy(curve, reach) ?? curve[curve.length - 1][1]
  return top >= Math.min(FORECAST_DARK_P72, threshold)
}

/** Runs the batches on the pool, as many at once as it has threads, never on the event loop. */
async function simulate(db: Db, todo: Candidate[], types: Awaited<ReturnType<typeof typeHashes>>, now: Date) {
  // The median dates repeat across a town: each local switch-on instant worked out once.
  const instants = new Map<string, Date>()
  const instant = (day: string, c: Candidate) => {
    const k = `${day}|${c.row.switchOn}|${c.zone}`
    return instants.get(k) ?? instants.set(k, forecastInstant(day, c.row.switchOn, c.zone)).get(k)!
  }
  const run = async (batch: Candidate[]) => {
    const requests = batch.map((c) =>
      stringForecastRequest(types.get(c.row.typeId)!.type, c.row, {
        burnHoursPerDay: c.burn,
        startDate: c.today,
        now,
        trials: JOB_TRIALS,
        pDarkAt: curveRequestHours(c.window?.burningHours ?? null),
      }),
    )
    const results = await forecastManyInPool(requests)
    const rows = results.map((fc, k) => {
      const c = batch[k]
      c.curve = compressCurve(fc.pDarkAt)
      c.age = 0
      return {
        id: c.row.id as number,
        forecastDarkAt: fc.medianDark ? instant(fc.medianDark, c) : null,
        forecastKey: c.key,
        forecastCurve: JSON.stringify(c.curve),
        forecastWatch: watched(c, riskThreshold(types.get(c.row.typeId)!.type.replaceRisk)),
      }
    })
    await updateById(
      db,
      'strings',
      rows,
      ['forecastDarkAt', 'forecastKey', 'forecastCurve', 'forecastWatch'],
      {
        same: { forecastAt: now },
      },
    )
  }
  // Two batches in flight per thread: while one computes, the next is queued and the last is stored,
  // so the threads never wait on the event loop or the database.
  let next = 0
  const lane = async () => {
    while (next < todo.length) {
      const batch = todo.slice(next, next + BATCH)
      next += BATCH
      await run(batch)
    }
  }
  await Promise.all(Array.from({ length: 2 * Math.max(1, workerThreads()) }, lane))
}

export async function refreshForecasts(
  db: Db,
  now = new Date(),
  o: RefreshOptions = {},
): Promise<ForecastRefresh> {
  const types = await typeHashes(db)
  const patrols = await nextPatrolDays(db, null, patrolSearchFrom(now))
  const candidates = await forecastCandidates(db, types, patrols, now, !!o.full)
  const todo = candidates.filter((c) => !c.curve)
  await simulate(db, todo, types, now)
  const risks: StringForecastRisk[] = []
  const outcomes: RiskOutcome[] = []
  for (const c of candidates) {
    const r = c.row
    const curve = c.curve!
    risks.push({
      id: r.id,
      assetTag: r.assetTag,
      status: r.status,
      siteId: r.siteId,
      clientId: r.clientId,
      pDark72: chanceDarkWithin(curve, c.age, 72) ?? 0,
      burnHoursPerDay: c.burn,
    })
    if (!c.window || !judged(r)) continue
    // No time at risk (a patrol under way) is no chance of going dark before it.
    outcomes.push({
      id: r.id,
      status: r.status,
      replaceRule: r.replaceRule ?? null,
      p: c.window.burningHours > 0 ? chanceDarkWithin(curve, c.age, c.window.burningHours) : 0,
      threshold: riskThreshold(types.get(r.typeId)!.type.replaceRisk),
      window: c.window,
    })
  }
  // The forecast item is for strings still lit or watched: one the risk rule flagged has its own item.
  const after = await applyRiskRule(db, outcomes, now)
  return {
    risks: risks.map((x) => ({ ...x, status: after.get(x.id) ?? x.status })),
    forecasts: todo.length,
    judged: candidates.length,
    flipped: [...after.keys()],
  }
}
