// Turns a string's recorded condition into the engine's input and our five state marks.
import type { AssessRequest, ForecastRequest } from './schemas/engine'
import { assess } from './engine/assess'

export const statuses = ['lit', 'watch', 'replace', 'dark', 'safe'] as const
export type StringStatus = (typeof statuses)[number]

export const statusLabel: Record<StringStatus, string> = {
  lit: 'Lit',
  watch: 'Watch',
  replace: 'Replace now',
  dark: 'Dark',
  safe: 'Made safe',
}

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

export interface VisitCounts {
  failedFound: number
  replaced: number
  fuseReplaced?: boolean
  darkOnArrival?: boolean
  leaveMadeSafe?: boolean
}

/**
 * What a visit does to a string's recorded condition (the server records it, the phone previews it):
 * found lamps add to those out, replaced ones come off, a replaced fuse lamp clears the fuse, any
 * relamp lights a dark string, "leave made safe" isolates it.
 */
export function applyVisit(before: Condition, v: VisitCounts): Condition {
  const fixed = v.replaced > 0 || !!v.fuseReplaced
  return {
    lampsOut: Math.max(0, before.lampsOut + v.failedFound - v.replaced),
    fuseFailed: v.fuseReplaced ? false : before.fuseFailed,
    dark: v.darkOnArrival ? !fixed : before.dark && !fixed,
    isolated: !!v.leaveMadeSafe,
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
