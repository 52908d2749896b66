// The engine applied to a string as recorded: its condition, lamp age and exposure, assessment and forecast.
import { conditionOf, engineInput, exposureAfter, forecastInput } from '../../shared/string-status'
import { forecast } from '../../shared/engine/forecast'
import { DEFAULT_SEED } from '../../shared/engine/defaults'
import { assess } from '../../shared/engine/assess'
import type { StringType } from './strings'

export interface StringRecord {
  id: number
  lampsOut: number
  fuseFailed: number | boolean
  dark: number | boolean
  isolated: number | boolean
  /** Burning hours on the lamps as of exposureAt. */
  lampAgeHours: number
  /** JSON array (text or parsed): rated-voltage hours per class as of exposureAt. */
  lampExposure?: unknown
  exposureAt?: Date | string | null
}

/** The columns of a `StringRecord` (plus its type), for a select on `strings` under `alias`. */
export const stringRecordColumns = (alias = 's') =>
  [
    'id',
    'typeId',
    'lampsOut',
    'fuseFailed',
    'dark',
    'isolated',
    'lampAgeHours',
    'lampExposure',
    'exposureAt',
  ].map((c) => `${alias}.${c}`)

/** Assessed at the string's own design supply: a 24 V curtain hangs on a 230 V circuit through its driver. */
export function stringAssessment(type: StringType, s: StringRecord) {
  return assess(engineInput(type, conditionOf(s), type.supplyVolts))
}

/** The stored exposure array (MariaDB keeps JSON as text); null when none was recorded. */
export function parseExposure(v: unknown): (number | null)[] | null {
  const a: unknown = typeof v === 'string' ? JSON.parse(v) : v
  return Array.isArray(a) ? a.map((x) => (typeof x === 'number' && Number.isFinite(x) ? x : null)) : null
}

/**
 * Burning hours between two instants: the client's hours a night × elapsed days, fractions of a day
 * included. An approximation: it does not know which nights the lights were actually on (the season's
 * ends, a timer fault) nor whether the change fell in the evening or the day. No start, no hours.
 */
export function burningHoursBetween(
  from: Date | string | null | undefined,
  to: Date,
  burnHoursPerDay: number,
) {
  if (!from) return 0
  const days = (to.getTime() - new Date(from).getTime()) / 86_400_000
  return days > 0 ? days * burnHoursPerDay : 0
}

/**
 * The string's lamp age (burning hours) and exposure per class brought up to `now`, in the condition
 * recorded since exposureAt (a string dark or made safe has not burned). Not stored: see exposureColumns.
 */
export function exposureNow(type: StringType, s: StringRecord, burnHoursPerDay: number, now: Date) {
  const c = conditionOf(s)
  const burning = c.dark || c.isolated ? 0 : burningHoursBetween(s.exposureAt, now, burnHoursPerDay)
  const lampExposure = exposureAfter(type, c, parseExposure(s.lampExposure), burning, s.lampAgeHours)
  return { lampAgeHours: s.lampAgeHours + burning, lampExposure }
}

/**
 * The columns that bring a string's age and exposure up to `now`: written at each change of state,
 * before it, so the hours so far count at the ratios then in force. Relamped lamps are new, but the
 * class keeps its survivors' exposure (the older lamps): conservative. A replaced fuse lamp is the
 * whole of its class when the string holds one: that class starts again from 0.
 */
export function exposureColumns(
  type: StringType,
  s: StringRecord,
  burnHoursPerDay: number,
  now: Date,
  o: { fuseReplaced?: boolean } = {},
) {
  const e = exposureNow(type, s, burnHoursPerDay, now)
  const chains = Math.max(1, type.branches ?? 1)
  if (o.fuseReplaced && conditionOf(s).fuseFailed) {
    const fuse = type.classes.findIndex((k) => !k.shunted)
    if (fuse >= 0 && type.classes[fuse].count * chains === 1) e.lampExposure[fuse] = 0
  }
  return {
    lampAgeHours: Math.round(e.lampAgeHours),
    lampExposure: JSON.stringify(e.lampExposure.map((x) => Math.round(x * 100) / 100)),
    exposureAt: now,
  }
}

export interface ForecastOptions {
  burnHoursPerDay: number
  /** The client's local day the forecast's dates count from. */
  startDate: string
  /** The instant the exposure is brought up to. */
  now: Date
  trials?: number
  /** Burning hours at which to report the chance of being dark. */
  pDarkAt?: number[]
}

/**
 * The engine's forecast request for a string as recorded now. Every string draws from the engine's one
 * seed, so the answer depends on the string's state alone (type, condition, lamp ages, schedule): two
 * strings in the same state share one simulation in the forecast cache, and the comparison of two
 * strings is not blurred by their draws (common random numbers).
 */
export function stringForecastRequest(type: StringType, s: StringRecord, o: ForecastOptions) {
  const e = exposureNow(type, s, o.burnHoursPerDay, o.now)
  return forecastInput(type, conditionOf(s), {
    lampAgeHours: e.lampAgeHours,
    exposure: e.lampExposure,
    burnHoursPerDay: o.burnHoursPerDay,
    startDate: o.startDate,
    trials: o.trials ?? 2000,
    seed: DEFAULT_SEED,
    ...(o.pDarkAt?.length ? { pDarkAt: o.pDarkAt } : {}),
  })
}

/** The engine's forecast for a string as recorded now (the string page's, 2,000 trials). */
export function stringForecast(type: StringType, s: StringRecord, o: ForecastOptions) {
  return forecast(stringForecastRequest(type, s, o))
}
