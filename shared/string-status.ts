// Turns a string's recorded condition into the engine's input and our five state marks (the words
// are in vocab/string-states.ts; what a visit does to the condition is in visit-rules.ts).
import type { AssessRequest, ForecastRequest } from './schemas/engine'
import type { StringStatus } from './vocab/string-states'
import { assess } from './engine/assess'
import { addExposure } from './engine/forecast'

/** One lamp class of a type as recorded; a null life setting means the type's. */
export interface ClassSpec {
  count: number
  ratedVolts: number
  ratedAmps: number
  shunted: boolean
  ratedLifeHours?: number | null
  lifeExponent?: number | null
}

export interface TypeSpec {
  technology?: 'filament' | 'led'
  wiring: 'series' | 'parallel'
  supplyVolts: number
  lifeExponent: number
  replaceAtRatio: number
  /** Parallel chains of `classes` (default 1). */
  branches?: number | null
  /** LED driver data (null: not known). */
  powerFactor?: number | null
  driverMinVolts?: number | null
  driverMaxVolts?: number | null
  /** LED driver switch-on surge: peak amps and how long it lasts (stringLoad's inrush fields). */
  inrushPeakAmps?: number | null
  inrushMs?: number | null
  classes: ClassSpec[]
}

export interface Condition {
  lampsOut: number
  fuseFailed: boolean
  dark: boolean
  isolated: boolean
}

/** A string's condition as recorded: a database row (booleans as 0/1) or the API's string page. */
export function conditionOf(s: {
  lampsOut: number
  fuseFailed: boolean | number
  dark: boolean | number
  isolated: boolean | number
}): Condition {
  return { lampsOut: s.lampsOut, fuseFailed: !!s.fuseFailed, dark: !!s.dark, isolated: !!s.isolated }
}

/**
 * The type's request-level fields the engine takes (assess; stringLoad also reads the inrush pair),
 * left out where the type does not set them.
 */
function typeFields(type: TypeSpec) {
  const out: Record<string, unknown> = {}
  if (type.technology) out.technology = type.technology
  if ((type.branches ?? 1) > 1) out.branches = type.branches
  for (const k of ['powerFactor', 'driverMinVolts', 'driverMaxVolts', 'inrushPeakAmps', 'inrushMs'] as const)
    if (type[k] != null) out[k] = type[k]
  // Spread into the request: the names are the engine's (request fields agreed for issue 11).
  return out as object
}

const chains = (type: TypeSpec) => Math.max(1, type.branches ?? 1)

/**
 * Lamps out are spread over the shunted classes in order (each class holds `count` × branches lamps;
 * the engine places them in the first chains); a failed fuse lamp is the first unshunted lamp.
 */
export function engineInput(type: TypeSpec, c: Condition, supplyVolts = type.supplyVolts): AssessRequest {
  let left = c.lampsOut
  let fuseLeft = c.fuseFailed ? 1 : 0
  const anyShunted = type.classes.some((k) => k.shunted)
  const lamps = type.classes.map((k) => {
    let failed = 0
    if (k.shunted || !anyShunted) {
      failed = Math.min(left, k.count * chains(type))
      left -= failed
    } else if (fuseLeft > 0) {
      failed = 1
      fuseLeft = 0
    }
    return { count: k.count, ratedVolts: k.ratedVolts, ratedAmps: k.ratedAmps, shunted: k.shunted, failed }
  })
  return {
    supplyVolts,
    lamps,
    wiring: type.wiring,
    lifeExponent: type.lifeExponent,
    replaceAtRatio: type.replaceAtRatio,
    ...typeFields(type),
  }
}

/** Lamps that can be out before the string is counted as failed in our records (every chain's). */
export function shuntedLampCount(type: TypeSpec): number {
  const shunted = type.classes.filter((k) => k.shunted)
  return (shunted.length ? shunted : type.classes).reduce((s, k) => s + k.count, 0) * chains(type)
}

export function stringStatus(type: TypeSpec, c: Condition) {
  const result = assess(engineInput(type, c))
  const status: StringStatus = c.isolated
    ? 'safe'
    : c.dark || !result.lit
      ? 'dark'
      : result.replaceNow
        ? 'replace'
        : c.lampsOut > 0
          ? 'watch'
          : 'lit'
  return { status, replaceNow: !c.isolated && (c.dark || result.replaceNow), result }
}

/** The columns a string row stores for its condition and the state worked out from it. */
export function stateColumns(c: Condition, s: ReturnType<typeof stringStatus>) {
  return {
    lampsOut: c.lampsOut,
    fuseFailed: c.fuseFailed,
    dark: !s.result.lit,
    isolated: c.isolated,
    status: s.status,
    replaceNow: s.replaceNow,
    // The forecast's risk rule is judged by the server's job; a change of state starts from the ratios.
    replaceRule: s.replaceNow ? ('ratio' as const) : null,
    riskNote: null,
    maxRatio: s.result.maxRatio,
  }
}

/** Each class's life exponent for exposure: its own, else the type's; LED lamps age by plain hours. */
export function exposureExponents(type: TypeSpec): number[] {
  return type.classes.map((k) => (type.technology === 'led' ? 0 : (k.lifeExponent ?? type.lifeExponent)))
}

/**
 * A string's exposure (rated-voltage hours per class) after `burningHours` more hours in condition
 * `c`: h × r^d per class at the ratios the engine gives now (cumulative exposure, Nelson 1980). A
 * string dark or made safe does not burn, so gains nothing. Classes without a stored figure start
 * from `fallbackHours` (burning hours).
 */
export function exposureAfter(
  type: TypeSpec,
  c: Condition,
  exposure: readonly (number | null)[] | null,
  burningHours: number,
  fallbackHours = 0,
): number[] {
  const start = type.classes.map((_, i) => exposure?.[i] ?? fallbackHours)
  if (c.isolated || c.dark || burningHours <= 0) return start
  const result = assess(engineInput(type, c))
  if (!result.lit) return start
  const ratios = type.classes.map((_, i) => result.classes[i]?.ratio ?? 0)
  return addExposure(start, burningHours, ratios, exposureExponents(type))
}

export interface LifeSpec extends TypeSpec {
  ratedLifeHours: number
  weibullShape: number
  shuntFailProbability: number
}

/**
 * The forecast's input for a string as recorded (phone preview and server alike), at its design
 * supply. `exposure` (rated-voltage hours per class) is where each class's lamps start; without it
 * every class starts from `lampAgeHours`.
 */
export function forecastInput(
  type: LifeSpec,
  c: Condition,
  o: {
    lampAgeHours: number
    exposure?: readonly (number | null)[] | null
    burnHoursPerDay: number
    startDate: string
    trials: number
    seed: number
    pDarkAt?: number[]
  },
): ForecastRequest {
  const { exposure, lampAgeHours, ...rest } = o
  const base = engineInput(type, c, type.supplyVolts)
  const lamps = base.lamps.map((l, i) => {
    const k = type.classes[i]
    const life: Record<string, number> = {}
    if (k.ratedLifeHours != null) life.ratedLifeHours = k.ratedLifeHours
    if (k.lifeExponent != null) life.lifeExponent = k.lifeExponent
    return { ...l, ageHours: exposure?.[i] ?? lampAgeHours, ...(life as object) }
  })
  return {
    ...base,
    lamps,
    // Every class carries its own age; the request-level figure only where no exposure is known.
    ...(exposure ? {} : { lampAgeHours }),
    ratedLifeHours: type.ratedLifeHours,
    weibullShape: type.weibullShape,
    shuntFailProbability: type.shuntFailProbability,
    ...rest,
  }
}
