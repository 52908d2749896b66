import type { StringLoadRequest } from '../schemas/engine'
import { assess } from './assess'
import { DEFAULT_LED_INRUSH_MULTIPLE, DEFAULT_OPERATING_KELVIN } from './defaults'
import { stringCondition } from './string-condition'
import { resistanceRatio } from './tungsten'

export interface StringLoad {
  runningAmps: number
  // first half-cycle current (RMS), comparable with breaker bands stated as multiples of rated current
  peakAmps: number
  watts: number
}

// Running and switch-on current of one string, ready for assessCircuit().
export function stringLoad(input: StringLoadRequest): StringLoad {
  const wiring = input.wiring ?? 'series'
  const condition = stringCondition(input.supplyVolts, input.lamps, wiring)
  if (condition.dark) return { runningAmps: 0, peakAmps: 0, watts: 0 }
  if (input.technology === 'led') {
    // LED drivers regulate current, so the filament voltage laws do not apply: running current is
    // the rated current, and switch-on a small driver inrush multiple (a setting per product).
    const runningAmps =
      wiring === 'parallel'
        ? input.lamps.reduce((s, c, i) => s + c.ratedAmps * condition.inCircuit[i], 0)
        : Math.max(...input.lamps.map((c, i) => (condition.inCircuit[i] > 0 ? c.ratedAmps : 0)))
    const multiple = input.ledInrushMultiple ?? DEFAULT_LED_INRUSH_MULTIPLE
    return { runningAmps, peakAmps: runningAmps * multiple, watts: runningAmps * input.supplyVolts }
  }
  const running = assess(input)
  // A cold filament has the hot resistance V_rated / I_rated divided by the tungsten ratio at the
  // operating temperature (≈ 15 at 2800 K: Forsythe & Worthing 1925; Wikipedia "Incandescent light
  // bulb" gives cold ≈ 1/15 of hot, Lamptech an inrush ≈ 14 × running).
  const ratio = resistanceRatio(input.operatingKelvin ?? DEFAULT_OPERATING_KELVIN)
  const cold = input.lamps.map((c) => c.ratedVolts / c.ratedAmps / ratio)
  const coldOhms =
    wiring === 'parallel'
      ? 1 / cold.reduce((s, r, i) => s + condition.inCircuit[i] / r, 0)
      : cold.reduce((s, r, i) => s + condition.inCircuit[i] * r, 0)
  return {
    runningAmps: running.stringAmps,
    peakAmps: input.supplyVolts / coldOhms,
    watts: running.stringWatts,
  }
}
