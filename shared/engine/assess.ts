import type { AssessRequest, AssessResponse } from '../schemas/engine'
import type { EngineState } from '../schemas/string-states'
import { DEFAULT_LIFE_EXPONENT, DEFAULT_REPLACE_AT_RATIO } from './defaults'
import { lampFactors } from './lamp-laws'
import { assessReasons } from './reasons'
import { lampsFailed, stringCondition } from './string-condition'

// Assessment of one string now: voltage per lamp, stress factors, and whether to replace now.
export function assess(input: AssessRequest): AssessResponse {
  const wiring = input.wiring ?? 'series'
  const lifeExponent = input.lifeExponent ?? DEFAULT_LIFE_EXPONENT
  const replaceAtRatio = input.replaceAtRatio ?? DEFAULT_REPLACE_AT_RATIO
  const condition = stringCondition(input.supplyVolts, input.lamps, wiring)
  const classes = input.lamps.map((c, i) => {
    const ratio = condition.ratios[i]
    return {
      lampsInCircuit: condition.inCircuit[i],
      voltsPerLamp: ratio * c.ratedVolts,
      ratio,
      ...lampFactors(ratio, lifeExponent),
    }
  })

  let stringAmps = 0
  let stringWatts = 0
  let maxAt = -1
  input.lamps.forEach((c, i) => {
    const n = condition.dark ? 0 : condition.inCircuit[i]
    stringWatts += n * c.ratedVolts * c.ratedAmps * classes[i].powerFactor
    if (wiring === 'parallel') stringAmps += n * c.ratedAmps * classes[i].currentFactor
    if (n > 0 && (maxAt < 0 || classes[i].ratio > classes[maxAt].ratio)) maxAt = i
  })
  if (wiring === 'series' && maxAt >= 0) {
    // One current flows through a series string. The voltage-share rule assumes equal rated current;
    // where ratings disagree we use their mean weighted by lamps in circuit.
    const lit = condition.inCircuit.reduce((a, b) => a + b, 0)
    const meanRatedAmps = input.lamps.reduce((s, c, i) => s + c.ratedAmps * condition.inCircuit[i], 0) / lit
    stringAmps = meanRatedAmps * classes[maxAt].currentFactor
  }
  const maxRatio = maxAt >= 0 ? classes[maxAt].ratio : 0
  const replaceNow = condition.dark || maxRatio >= replaceAtRatio - 1e-9
  const anyOut = input.lamps.some((c) => lampsFailed(c) > 0)
  const state: EngineState = condition.dark ? 'dark' : replaceNow ? 'replace' : anyOut ? 'watch' : 'lit'
  const reasons = assessReasons({
    wiring,
    lamps: input.lamps,
    condition,
    maxRatio,
    lifeFactorAtMax: maxAt >= 0 ? classes[maxAt].lifeFactor : 0,
    replaceAtRatio,
  })
  return { lit: !condition.dark, state, stringAmps, stringWatts, maxRatio, replaceNow, reasons, classes }
}
