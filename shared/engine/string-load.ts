import type { StringLoadRequest } from '../schemas/engine'
import { DEFAULT_HOT_COLD_RATIO } from './defaults'
import { lawsRange } from './lamp-laws'
import { isLed, ledRun } from './led'
import { stringCondition } from './string-condition'
import { resistanceRatio } from './tungsten'

export interface StringLoad {
  runningAmps: number
  // first half-cycle current (RMS), comparable with breaker bands stated as multiples of rated current
  peakAmps: number
  /** real power: volts × running amps × power factor */
  watts: number
  /** apparent power: volts × running amps (what the breaker and cable carry) */
  voltAmps: number
  powerFactor: number
  /** how long the switch-on peak lasts, when the type's data says (LED drivers); null otherwise */
  peakMs: number | null
  /** false when an LED type gives no switch-on data: peakAmps is then just the running current */
  surgeKnown: boolean
  /** false when the filament laws do not hold at this supply: running figures are extrapolations */
  lawsApply: boolean
}

const DARK: StringLoad = {
  runningAmps: 0,
  peakAmps: 0,
  watts: 0,
  voltAmps: 0,
  powerFactor: 1,
  peakMs: null,
  surgeKnown: true,
  lawsApply: true,
}

// Running and switch-on current of one string, ready for assessCircuit().
export function stringLoad(input: StringLoadRequest): StringLoad {
  const V = input.supplyVolts
  if (isLed(input)) {
    // Constant power per lamp: amps = Σ V_rated · I_rated / V, watts = V × amps × PF (led.ts).
    const run = ledRun(input)
    if (run.cond.dark) return { ...DARK, powerFactor: run.powerFactor }
    const runningAmps = run.amps
    // Switch-on: the driver's peak from the type's data. Without it the surge is unknown: we show the
    // running current and say so (surgeKnown false) rather than invent a multiple.
    const peakAmps =
      input.inrushPeakAmps ??
      (input.ledInrushMultiple != null ? runningAmps * input.ledInrushMultiple : runningAmps)
    return {
      runningAmps,
      peakAmps: Math.max(peakAmps, runningAmps),
      watts: V * runningAmps * run.powerFactor,
      voltAmps: V * runningAmps,
      powerFactor: run.powerFactor,
      peakMs: input.inrushMs ?? null,
      surgeKnown: input.inrushPeakAmps != null || input.ledInrushMultiple != null,
      lawsApply: true,
    }
  }
  const wiring = input.wiring ?? 'series'
  const cond = stringCondition(V, input.lamps, wiring, input.branches ?? 1)
  if (cond.dark) return DARK
  // The chains' solved current (series-share.ts), extrapolated where the laws do not hold: a circuit
  // check still needs a figure; `lawsApply` says how far to trust it.
  const lawsApply = input.lamps.every(
    (_, i) =>
      cond.lit[i] === 0 || (lawsRange(cond.ratios[i]) === 'ok' && lawsRange(cond.minRatios[i]) === 'ok'),
  )
  // A cold filament has the hot resistance V_rated / I_rated divided by the hot/cold ratio: the type's,
  // else the tungsten table at a stated temperature (Forsythe & Worthing 1925), else ≈ 11, the bench
  // figure of small series lamps (trade-reference §2a, bench measurement, common practice; the
  // published ≈ 15 and Lamptech's inrush ≈ 14 × running are for larger lamps running hotter).
  const ratio =
    input.hotColdRatio ??
    (input.operatingKelvin != null ? resistanceRatio(input.operatingKelvin) : DEFAULT_HOT_COLD_RATIO)
  const cold = input.lamps.map((c) => c.ratedVolts / c.ratedAmps / ratio)
  let peakAmps = 0
  for (const chain of cond.chains) {
    if (chain.dark) continue
    // Parallel: every lamp across the supply; series: each lit chain's lamps in series, chains side by side.
    if (wiring === 'parallel') peakAmps += cold.reduce((s, r, i) => s + (chain.inCircuit[i] * V) / r, 0)
    else peakAmps += (chain.weight * V) / cold.reduce((s, r, i) => s + chain.inCircuit[i] * r, 0)
  }
  return {
    runningAmps: cond.amps,
    peakAmps,
    watts: V * cond.amps,
    voltAmps: V * cond.amps,
    powerFactor: 1,
    peakMs: null,
    surgeKnown: true,
    lawsApply,
  }
}
