// The heavy computations as the routes and services call them: size checked first (413 `too_large`
// before any work starts), then a job slot, then the worker pool with a wall-clock limit.
import type { Response } from 'express'
import { HttpError } from '../errors'
import { forecastCost, MAX_FORECAST_COST } from '../../shared/engine/defaults'
import { MAX_TOUR_COST, tourCost } from '../../shared/routing/limits'
import type { ForecastRequest, ForecastResponse } from '../../shared/schemas/engine'
import type { TourResult } from '../../shared/routing/solve'
import type { PlanInput, PlanResult } from '../../shared/routing/plan'
import type { VrptwResult } from '../../shared/routing/vrptw/index'
import { vrptwCost } from '../../shared/routing/vrptw/limits'
import { runInPool } from './pool'
import { takeJobSlot } from './job-slots'
import type { TaskName } from './tasks'
import type { PdfInput } from '../services/client-report-pdf-layout'

export interface JobOwner {
  userId: number
  res: Response
}

// The largest allowed forecast takes about a second on one core; the limit leaves room for a slow host.
const FORECAST_TIMEOUT_MS = 15_000
// A batch of 200 job forecasts at 400 trials takes about a second on one core.
const FORECAST_BATCH_TIMEOUT_MS = 60_000
// Beyond the search's own time limit: checking a 1,000-stop matrix, neighbour lists, the answer.
const TOUR_GRACE_MS = 3_000
// The largest plan (50 crews, 500 items) takes about 6.5 s on one core (a synthetic plan of that size).
const PLAN_TIMEOUT_MS = 30_000

const fmt = (n: number) => n.toLocaleString('en-GB')

async function runJob<T>(task: TaskName, input: unknown, timeoutMs: number, owner?: JobOwner): Promise<T> {
  const release = takeJobSlot(owner?.userId, owner?.res)
  // A client that hangs up does not keep a thread busy for an answer nobody reads.
  const gone = new AbortController()
  const onClose = () => {
    if (!owner!.res.writableEnded) gone.abort()
  }
  owner?.res.once('close', onClose)
  try {
    return await runInPool<T>(task, input, { timeoutMs, signal: gone.signal })
  } finally {
    owner?.res.off('close', onClose)
    release()
  }
}

export function forecastInPool(body: ForecastRequest, owner: JobOwner): Promise<ForecastResponse> {
  const { lamps, trials, cost } = forecastCost(body)
  if (cost > MAX_FORECAST_COST) {
    const fewer = Math.floor(MAX_FORECAST_COST / lamps)
    const advice =
      fewer >= 1
        ? `Ask for at most ${fmt(fewer)} trials for these lamps, or forecast the string in parts.`
        : 'Forecast the string in parts.'
    throw new HttpError(
      413,
      'too_large',
      `This forecast is ${fmt(trials)} trials × ${fmt(lamps)} lamps in circuit = ${fmt(cost)} lamp-trials; ` +
        `the limit is ${fmt(MAX_FORECAST_COST)}. ${advice}`,
      { limit: MAX_FORECAST_COST, cost },
    )
  }
  return runJob('forecast', body, FORECAST_TIMEOUT_MS, owner)
}

/** Takes the raw body: the pool thread validates it, as checking a large matrix is work too. */
export function solveTourInPool(body: unknown, owner: JobOwner): Promise<TourResult> {
  const { stops, timeLimitMs, cost } = tourCost((body ?? {}) as Record<string, unknown>)
  if (cost > MAX_TOUR_COST) {
    const shorter = Math.floor(MAX_TOUR_COST / stops)
    throw new HttpError(
      413,
      'too_large',
      `This search is ${fmt(stops)} stops × ${fmt(timeLimitMs)} ms = ${fmt(cost)} stop-milliseconds; ` +
        `the limit is ${fmt(MAX_TOUR_COST)}. Set timeLimitMs to at most ${fmt(shorter)} for ${fmt(stops)} stops, ` +
        'or split the stops into smaller tours.',
      { limit: MAX_TOUR_COST, cost },
    )
  }
  return runJob('solve', body, timeLimitMs + TOUR_GRACE_MS, owner)
}

/** VRPTW search (POST /routing/solve-vrptw): the same stop-milliseconds cap as the tour search. */
export function solveVrptwInPool(body: unknown, owner: JobOwner): Promise<VrptwResult> {
  const { stops, timeLimitMs, cost } = vrptwCost((body ?? {}) as Record<string, unknown>)
  if (cost > MAX_TOUR_COST) {
    const shorter = Math.floor(MAX_TOUR_COST / stops)
    throw new HttpError(
      413,
      'too_large',
      `This search is ${fmt(stops)} stops × ${fmt(timeLimitMs)} ms = ${fmt(cost)} stop-milliseconds; ` +
        `the limit is ${fmt(MAX_TOUR_COST)}. Set timeLimitMs to at most ${fmt(shorter)} for ${fmt(stops)} stops, ` +
        'or split the stops into smaller requests.',
      { limit: MAX_TOUR_COST, cost },
    )
  }
  return runJob('solveVrptw', body, timeLimitMs + TOUR_GRACE_MS, owner)
}

/** Run planning has its own size limits (crews and items); here it only moves off the event loop. */
export function planRunsInPool(input: PlanInput, owner?: JobOwner): Promise<PlanResult> {
  return runJob('plan', input, PLAN_TIMEOUT_MS, owner)
}

// Reading 50,000 rows (the import's cap) takes a few seconds on one core.
const REGISTER_READ_TIMEOUT_MS = 60_000

/** An import's file parsed and checked off the event loop; the caller has checked its size. */
export function readRegisterInPool<T>(input: unknown, owner: JobOwner): Promise<T> {
  return runJob('registerRead', input, REGISTER_READ_TIMEOUT_MS, owner)
}

// A client report's PDF is drawn in about a second on a busy core.
const PDF_TIMEOUT_MS = 30_000

/** A client report's PDF drawn off the event loop (services/client-report-pdf-layout.ts). */
export function pdfInPool(input: PdfInput, owner?: JobOwner): Promise<Uint8Array> {
  return runJob('clientReportPdf', input, PDF_TIMEOUT_MS, owner)
}

/** A batch of forecasts for the scheduled queue job (no user waits on it, so no job slot). */
export function forecastManyInPool(
  requests: ForecastRequest[],
): Promise<{ pDark72: number; medianDark: string | null; pDarkAt: { hours: number; p: number }[] }[]> {
  return runInPool('forecastMany', requests, { timeoutMs: FORECAST_BATCH_TIMEOUT_MS })
}
