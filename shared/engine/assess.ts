import type { AssessRequest, AssessResponse } from '../schemas/engine'
import type { EngineState } from '../vocab/string-states'
import { DEFAULT_LIFE_EXPONENT, DEFAULT_REPLACE_AT_RATIO } from './defaults'
import { lampFactors, lawsRange } from './lamp-laws'
import { assessLed, isLed } from './led'
import { faultReasons } from './fault-reasons'
import { stressReasons } from './reasons'
import { stringCondition, type StringCondition } from './string-condition'

/** The string's range against the laws: 'high' if any lit lamp is over, else 'low' if any is under. */
function stringRange(cond: StringCondition): 'low' | 'ok' | 'high' {
  const lit = cond.ratios.map((_, i) => i).filter((i) => cond.lit[i] > 0)
  if (lit.some((i) => lawsRange(cond.ratios[i]) === 'high')) return 'high'
  if (lit.some((i) => lawsRange(cond.minRatios[i]) === 'low')) return 'low'
  return 'ok'
}

// Assessment of one string now: the one current in each series chain solved from every class's own
// rating (series-share.ts), volts × amps = watts, stress factors where the lamp laws hold, and whether
// to replace now. LED strings follow the constant-current model of led.ts.
export function assess(input: AssessRequest): AssessResponse {
  if (isLed(input)) return assessLed(input)
  const wiring = input.wiring ?? 'series'
  const lifeExponent = input.lifeExponent ?? DEFAULT_LIFE_EXPONENT
  const replaceAtRatio = input.replaceAtRatio ?? DEFAULT_REPLACE_AT_RATIO
  const cond = stringCondition(input.supplyVolts, input.lamps, wiring, input.branches ?? 1)
  const range = cond.dark ? 'ok' : stringRange(cond)
  // Vacuously true for a dark string: no lamp lit, nothing extrapolated.
  const lawsApply = range === 'ok'
  const classes = input.lamps.map((c, i) => {
    const ratio = cond.ratios[i]
    const lit = ratio > 0
    // Series: the class's current is its chain's, I_rated · r^0.55 from the solve; parallel: its own.
    const f = lawsApply && lit ? lampFactors(ratio, lifeExponent) : null
    const ampsPerLamp = f ? c.ratedAmps * f.currentFactor : null
    const voltsPerLamp = ratio * c.ratedVolts
    return {
      lampsInCircuit: cond.inCircuit[i],
      lampsLit: cond.lit[i],
      voltsPerLamp,
      ratio,
      ampsPerLamp,
      wattsPerLamp: ampsPerLamp === null ? null : voltsPerLamp * ampsPerLamp,
      currentFactor: f?.currentFactor ?? null,
      powerFactor: f?.powerFactor ?? null,
      lightFactor: f?.lightFactor ?? null,
      lifeFactor: f?.lifeFactor ?? null,
    }
  })

  let maxAt = -1
  classes.forEach((c, i) => {
    if (c.lampsLit > 0 && (maxAt < 0 || c.ratio > classes[maxAt].ratio)) maxAt = i
  })
  const maxRatio = maxAt >= 0 ? classes[maxAt].ratio : 0
  const stringAmps = lawsApply ? cond.amps : null
  const anyOut = input.lamps.some((c) => (c.failed ?? 0) + (c.opened ?? 0) + (c.removed ?? 0) > 0)
  // An empty socket is live (trade-reference §2a): in a parallel string too, fit a lamp now.
  const removed = input.lamps.some((c) => (c.removed ?? 0) > 0)
  const replaceNow =
    cond.dark || range === 'high' || cond.branchesDark > 0 || removed || maxRatio >= replaceAtRatio - 1e-9
  const state: EngineState = cond.dark
    ? 'dark'
    : replaceNow
      ? 'replace'
      : anyOut || range === 'low'
        ? 'watch'
        : 'lit'
  const reasons = faultReasons(input.lamps, cond, wiring)
  if (!cond.dark)
    reasons.push(
      ...stressReasons({
        wiring,
        lamps: input.lamps,
        condition: cond,
        maxRatio,
        maxAt,
        lifeFactorAtMax: maxAt >= 0 ? classes[maxAt].lifeFactor : null,
        range,
        replaceAtRatio,
      }),
    )
  return {
    lit: !cond.dark,
    state,
    technology: 'filament',
    lawsApply,
    stringVolts: input.supplyVolts,
    stringAmps,
    // Volts × amps exactly: the number an electrician gets multiplying the two on the page.
    stringWatts: stringAmps === null ? null : input.supplyVolts * stringAmps,
    powerFactor: 1,
    branches: cond.branches,
    branchesDark: cond.branchesDark,
    maxRatio,
    replaceNow,
    reasons,
    classes,
  }
}
