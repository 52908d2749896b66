import type { ForecastRequest, ForecastResponse } from '../schemas/engine'
import { burningHoursToDate, burningHoursToDates } from './calendar'
import { DEFAULT_BURN_HOURS_PER_DAY, HORIZON_HOURS, P_DARK_HOURS } from './defaults'

/** What the trials record: the first `reported` failure times (running mean and variance) and dark. */
export class TrialLog {
  readonly reached: Int32Array
  readonly meanK: Float64Array
  readonly m2: Float64Array
  /** burning hours to dark per trial, Infinity when not dark within the horizon */
  readonly darkAt: Float64Array
  /** per lamp class: trials that went dark at a failure of that class */
  readonly darkBy: Int32Array

  constructor(
    readonly trials: number,
    reported: number,
    classes: number,
    darkNow: boolean,
  ) {
    this.reached = new Int32Array(reported)
    this.meanK = new Float64Array(reported)
    this.m2 = new Float64Array(reported)
    this.darkAt = new Float64Array(trials).fill(darkNow ? 0 : Infinity)
    this.darkBy = new Int32Array(classes)
  }

  /** The k-th failure from now (0-based) at `t` burning hours: Welford's running mean and variance. */
  failure(k: number, t: number) {
    const n = ++this.reached[k]
    const delta = t - this.meanK[k]
    this.meanK[k] += delta / n
    this.m2[k] += delta * (t - this.meanK[k])
  }

  dark(trial: number, t: number, lampClass: number) {
    this.darkAt[trial] = t
    if (Number.isFinite(t)) this.darkBy[lampClass]++
  }
}

/** Share of trials dark by `hours`; `sorted` ascending. */
function shareBy(sorted: Float64Array, hours: number): number {
  let lo = 0
  let hi = sorted.length
  while (lo < hi) {
    const mid = (lo + hi) >>> 1
    if (sorted[mid] <= hours) lo = mid + 1
    else hi = mid
  }
  return lo / sorted.length
}

// Turns the trials' log into the published summary (sorts `log.darkAt` in place).
export function summarise(input: ForecastRequest, log: TrialLog): ForecastResponse {
  const { trials, reached, meanK, m2, darkAt } = log
  const meanHoursToFailure = Array.from(meanK, (m, k) => (reached[k] > 0 ? m : null))
  const standardError = Array.from(m2, (s, k) =>
    reached[k] > 1 ? Math.sqrt(s / (reached[k] - 1) / reached[k]) : null,
  )
  const pReached = Array.from(reached, (n) => n / trials)
  darkAt.sort()
  let darkCount = 0
  let darkSum = 0
  for (const t of darkAt) {
    if (!Number.isFinite(t)) break
    darkCount++
    darkSum += t
  }
  const mid = (trials - 1) / 2
  const median = (darkAt[Math.floor(mid)] + darkAt[Math.ceil(mid)]) / 2
  const medianHoursToDark = Number.isFinite(median) ? median : null
  const meanHoursToDark = darkCount > 0 ? darkSum / darkCount : null
  const at = (hours: number) => ({ hours, p: shareBy(darkAt, hours) })
  const result: ForecastResponse = {
    trials,
    meanHoursToFailure,
    standardError,
    pReached,
    meanHoursToDark,
    medianHoursToDark,
    pDarkWithinHorizon: darkCount / trials,
    horizonHours: HORIZON_HOURS,
    pDark: P_DARK_HOURS.map(at),
    pDarkAt: (input.pDarkAt ?? []).map(at),
    darkByClass: Array.from(log.darkBy, (n) => n / trials),
  }
  if (input.startDate) {
    const perDay = input.burnHoursPerDay ?? DEFAULT_BURN_HOURS_PER_DAY
    result.dates = {
      failures: burningHoursToDates(meanHoursToFailure, input.startDate, perDay),
      meanDark: burningHoursToDate(meanHoursToDark, input.startDate, perDay),
      medianDark: burningHoursToDate(medianHoursToDark, input.startDate, perDay),
    }
  }
  return result
}
