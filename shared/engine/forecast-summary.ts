import type { ForecastRequest, ForecastResponse } from '../schemas/engine'
import { burningHoursToDate, burningHoursToDates } from './calendar'
import { DEFAULT_BURN_HOURS_PER_DAY, HORIZON_HOURS, P_DARK_HOURS } from './defaults'

// Turns the per-trial results of forecast() into the published summary. `darkAt` holds burning hours
// to dark per trial (Infinity when not dark within the horizon) and is sorted in place.
export function summarise(
  input: ForecastRequest,
  trials: number,
  reached: Int32Array,
  meanK: Float64Array,
  m2: Float64Array,
  darkAt: Float64Array,
): ForecastResponse {
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
  const pDark = P_DARK_HOURS.map((hours) => ({
    hours,
    p: darkAt.filter((t) => t <= hours).length / trials,
  }))
  const result: ForecastResponse = {
    trials,
    meanHoursToFailure,
    standardError,
    pReached,
    meanHoursToDark,
    medianHoursToDark,
    pDarkWithinHorizon: darkCount / trials,
    horizonHours: HORIZON_HOURS,
    pDark,
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
