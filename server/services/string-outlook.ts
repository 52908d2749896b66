// The string page's lead forecast: the chance of going dark within 72 burning hours and the likely
// dark day. It comes from the forecast the queue judges by, which the forecast job stores on the
// string (jobs/refresh-forecasts.ts), read at the hours burned since it was made, so the page and the
// queue say the same and opening a string runs no simulation. Only when that forecast is older than the
// string's last change (a visit, a retyping or new ratings: each brings the exposure up to date), more
// than a day old, or missing, does the page work its own out; the job makes it again within seconds of
// a visit or an edit (refresh-soon.ts) and at its 10-minute tick. The whole forecast (the chart and its table) has its own route, asked for when
// someone opens "How this is worked out".
import type { ForecastResponse } from '../../shared/schemas/engine-forecast'
import type { StringOutlook } from '../../shared/schemas/strings'
import { localDay } from '../../shared/local-time'
import {
  chanceDarkWithin,
  curveAge,
  JOB_TRIALS,
  MAX_FORECAST_AGE_HOURS,
  parseCurve,
} from '../jobs/forecast-curve'

/** The horizon of the page's lead chance: the queue's "may go dark" item reads the same. */
export const OUTLOOK_HOURS = 72

export interface StoredForecast {
  forecastCurve: unknown
  forecastAt: Date | string | null
  forecastDarkAt: Date | string | null
  /** When the string's condition last changed (a visit sets it). */
  exposureAt: Date | string | null
}

const time = (v: Date | string | null | undefined) => (v == null ? NaN : new Date(v).getTime())

/**
 * The stored forecast read now, or null when it is missing, older than the string's last change, more
 * than a day old, or too short to reach 72 burning hours from now.
 */
export function storedOutlook(
  s: StoredForecast,
  burnHoursPerDay: number,
  zone: string,
  now: Date,
): StringOutlook | null {
  const madeAt = time(s.forecastAt)
  const curve = parseCurve(s.forecastCurve)
  if (!curve || !Number.isFinite(madeAt)) return null
  if (time(s.exposureAt) > madeAt) return null
  if (now.getTime() - madeAt > MAX_FORECAST_AGE_HOURS * 3_600_000) return null
  const p = chanceDarkWithin(curve, curveAge(new Date(madeAt), now, burnHoursPerDay), OUTLOOK_HOURS)
  if (p === null) return null
  const dark = time(s.forecastDarkAt)
  return {
    pDark72: p,
    darkDate: Number.isFinite(dark) ? localDay(dark, zone) : null,
    madeAt: new Date(madeAt).toISOString(),
    trials: JOB_TRIALS,
    source: 'queue',
  }
}

/** The same figures from a forecast the page worked out itself, just now. */
export function outlookOf(fc: ForecastResponse, now: Date): StringOutlook {
  return {
    pDark72: fc.pDark.find((d) => d.hours === OUTLOOK_HOURS)?.p ?? null,
    darkDate: fc.dates?.medianDark ?? null,
    madeAt: now.toISOString(),
    trials: fc.trials,
    source: 'page',
  }
}
