// A stored forecast's chance-of-dark curve, so the queue re-judges a string as time passes without a
// new simulation. The curve is the forecast's share of trials dark by h burning hours from the moment
// it was made (F(h)), at the hours of CURVE_HOURS plus the two the risk window needs. Read later, after
// `a` burning hours with no change recorded, the chance of going dark within the next `w` hours is
// taken as F's conditional share (F(a + w) − F(a)) / (1 − F(a)): the trials still lit at `a`, some of
// which have lost lamps on the way. A fresh forecast would start from the recorded lamps (none lost
// since) with their exposure grown by `a` hours, so its chance is at most this one for a string whose
// risk only rises with lamps out (series strings: each loss raises the others' voltage): the stored
// reading errs towards flagging. Forecasts are renewed within a day anyway (refresh-forecasts.ts).
import { burningHoursBetween } from '../services/string-engine'

/** One point of a curve: [burning hours from the forecast, share of trials dark by then]. */
export type CurvePoint = [number, number]

/** The longest a stored forecast is read before it is made again (wall-clock hours). */
export const MAX_FORECAST_AGE_HOURS = 24

/** Trials of a stored forecast: fewer than the string page's; enough for a queue threshold, fast for a town. */
export const JOB_TRIALS = 400

// Every hour to 4 nights (the 72 h item and a day's ageing), every 6 h to two weeks, then daily to
// 60 days of burning: patrols further out than that are read from a forecast made for their window.
export const CURVE_HOURS: readonly number[] = [
  ...Array.from({ length: 97 }, (_, i) => i),
  ...Array.from({ length: 40 }, (_, i) => 102 + 6 * i),
  ...Array.from({ length: 46 }, (_, i) => 360 + 24 * i),
]

/** A change here changes every forecast key: stored curves of another shape are made again. */
export const CURVE_VERSION = 'curve-1'

/**
 * The hours to ask the forecast about: the grid, plus the risk window as it stands now (read exactly
 * today) and that window a day of burning on (a response window does not shrink as time passes).
 */
export function curveRequestHours(windowHours: number | null, maxBurnPerDay = 24): number[] {
  const k = `${windowHours}|${maxBurnPerDay}`
  let hours = asked.get(k)
  if (!hours) {
    const extra = windowHours !== null && windowHours > 0 ? [windowHours, windowHours + maxBurnPerDay] : []
    hours = [...new Set([...CURVE_HOURS, ...extra])].sort((a, b) => a - b)
    // Windows are rounded to a tenth of an hour: few distinct ones, but never let the memo grow unbounded.
    if (asked.size > 10_000) asked.clear()
    asked.set(k, hours)
  }
  return hours
}
const asked = new Map<string, number[]>()

/** Keeps the points where the share changes (and the ends of each flat run): linear reads are unchanged. */
export function compressCurve(points: readonly { hours: number; p: number }[]): CurvePoint[] {
  const out: CurvePoint[] = []
  points.forEach((pt, i) => {
    const prev = points[i - 1]?.p
    const next = points[i + 1]?.p
    if (i === 0 || i === points.length - 1 || pt.p !== prev || pt.p !== next) out.push([pt.hours, pt.p])
  })
  return out
}

/** The curve as stored text (or parsed JSON), or null when none or unreadable. */
export function parseCurve(v: unknown): CurvePoint[] | null {
  if (v === null || v === undefined) return null
  try {
    const a: unknown = typeof v === 'string' ? JSON.parse(v) : v
    return Array.isArray(a) && a.length ? (a as CurvePoint[]) : null
  } catch {
    return null
  }
}

/** F(h), linear between points; null beyond the last point (the curve does not reach that far). */
export function shareDarkBy(curve: readonly CurvePoint[], hours: number): number | null {
  const last = curve[curve.length - 1]
  if (hours > last[0] + 1e-9) return null
  if (hours <= curve[0][0]) return curve[0][1]
  let lo = 0
  let hi = curve.length - 1
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1
    if (curve[mid][0] <= hours) lo = mid
    else hi = mid
  }
  const [h0, p0] = curve[lo]
  const [h1, p1] = curve[hi]
  return h1 === h0 ? p1 : p0 + ((p1 - p0) * (hours - h0)) / (h1 - h0)
}

/**
 * The chance of going dark within `within` burning hours, `age` burning hours after the forecast:
 * the conditional share above. Null when the curve does not reach age + within.
 */
export function chanceDarkWithin(curve: readonly CurvePoint[], age: number, within: number): number | null {
  const end = shareDarkBy(curve, Math.max(0, age) + within)
  if (end === null) return null
  if (age <= 0) return end
  const start = shareDarkBy(curve, age)!
  // Every trial dark by now: nothing lit is left to judge, so say certain.
  if (start >= 1) return 1
  return Math.min(1, Math.max(0, (end - start) / (1 - start)))
}

/** Burning hours since the forecast was made, at the client's hours a night. */
export const curveAge = (forecastAt: Date | string | null, now: Date, burnHoursPerDay: number) =>
  burningHoursBetween(forecastAt, now, burnHoursPerDay)
