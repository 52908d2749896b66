// Turns a string's recorded condition into the engine's input and our five state marks (the words
// are in schemas/string-states.ts; what a visit does to the condition is in visit-rules.ts).
import type { AssessRequest, ForecastRequest } from './schemas/engine'
import type { StringStatus } from './schemas/string-states'
import { assess } from './engine/assess'

export { statuses, statusLabel, type StringStatus } from './schemas/string-states'

export interface TypeSpec {
  wiring: 'series' | 'parallel'
  supplyVolts: number
  lifeExponent: number
  replaceAtRatio: number
  classes: { count: number; ratedVolts: number; ratedAmps: number; shunted: boolean }[]
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

/** Lamps out are spread over the shunted classes in order; a failed fuse lamp is the first unshunted lamp. */
export function engineInput(type: TypeSpec, c: Condition, supplyVolts = type.supplyVolts): AssessRequest {
  let left = c.lampsOut
  let fuseLeft = c.fuseFailed ? 1 : 0
  const anyShunted = type.classes.some((k) => k.shunted)
  const lamps = type.classes.map((k) => {
    let failed = 0
    if (k.shunted || !anyShunted) {
      failed = Math.min(left, k.count)
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
  }
}

/** Lamps that can be out before the string is counted as failed in our records. */
export function shuntedLampCount(type: TypeSpec): number {
  const shunted = type.classes.filter((k) => k.shunted)
  return (shunted.length ? shunted : type.classes).reduce((s, k) => s + k.count, 0)
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
    maxRatio: s.result.maxRatio,
  }
}

export interface LifeSpec extends TypeSpec {
  ratedLifeHours: number
  weibullShape: number
  shuntFailProbability: number
}

/** The forecast's input for a string as recorded (phone preview and server alike), at its design supply. */
export function forecastInput(
  type: LifeSpec,
  c: Condition,
  o: { lampAgeHours: number; burnHoursPerDay: number; startDate: string; trials: number; seed: number },
): ForecastRequest {
  return {
    ...engineInput(type, c, type.supplyVolts),
    ratedLifeHours: type.ratedLifeHours,
    weibullShape: type.weibullShape,
    shuntFailProbability: type.shuntFailProbability,
    ...o,
  }
}
