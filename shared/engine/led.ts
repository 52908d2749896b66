// LED strings: a driver regulates the LED current, so the filament laws do not apply. Within the
// driver's input range the LEDs run at rated current and the supply does not shorten their life; the
// driver draws constant power P = V_rated · I_rated · PF per lamp, so the input current is
// P / (V · PF). A failed LED section does not short: it opens its series chain.
import type { AssessRequest, AssessResponse } from '../schemas/engine'
import type { EngineState } from '../vocab/string-states'
import { DEFAULT_DRIVER_TOLERANCE, DEFAULT_LED_POWER_FACTOR } from './defaults'
import { ISOLATION_CAUTION, type Reason } from './reason-codes'
import { darkWhere, lamps as lampWord } from './reasons'
import { stringCondition } from './string-condition'

/** LED when the request says so, or when every class with lamps says so. */
export function isLed(input: AssessRequest): boolean {
  if (input.technology === 'led') return true
  const withLamps = input.lamps.filter((c) => c.count > 0)
  return withLamps.length > 0 && withLamps.every((c) => c.technology === 'led')
}

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0)
const volts = (v: number) => `${+v.toFixed(1)} V`

export interface LedRun {
  cond: ReturnType<typeof stringCondition>
  /** driver input nominal per class: the chain's rated volts (series) or the lamp's (parallel) */
  nominal: number[]
  minVolts: number[]
  maxVolts: number[]
  range: 'low' | 'ok' | 'high'
  powerFactor: number
  /** input current of the lit string: Σ V_rated · I_rated / V over lit lamps */
  amps: number
}

/** The LED string's electrical state, with figures whether or not the driver is in range. */
export function ledRun(input: AssessRequest): LedRun {
  const wiring = input.wiring ?? 'series'
  const series = wiring === 'series'
  const V = input.supplyVolts
  // A failed section opens its chain in series: treat every class as having no shunt.
  const ls = input.lamps.map((c) => ({ ...c, shunted: series ? false : c.shunted }))
  const cond = stringCondition(V, ls, wiring, input.branches ?? 1)
  const chainVolts = sum(ls.map((c) => c.count * c.ratedVolts))
  const nominal = ls.map((c) => (series ? chainVolts : c.ratedVolts))
  const tol = DEFAULT_DRIVER_TOLERANCE
  const minVolts = nominal.map((n) => input.driverMinVolts ?? n * (1 - tol))
  const maxVolts = nominal.map((n) => input.driverMaxVolts ?? n * (1 + tol))
  const lit = ls.map((_, i) => i).filter((i) => cond.lit[i] > 0)
  const range = lit.some((i) => V > maxVolts[i] + 1e-9)
    ? 'high'
    : lit.some((i) => V < minVolts[i] - 1e-9)
      ? 'low'
      : 'ok'
  const amps = sum(ls.map((c, i) => (cond.lit[i] * c.ratedVolts * c.ratedAmps) / V))
  return {
    cond,
    nominal,
    minVolts,
    maxVolts,
    range,
    powerFactor: input.powerFactor ?? DEFAULT_LED_POWER_FACTOR,
    amps,
  }
}

function ledReasons(input: AssessRequest, run: LedRun): Reason[] {
  const { cond } = run
  const series = (input.wiring ?? 'series') === 'series'
  const out: Reason[] = []
  const failed = sum(input.lamps.map((c) => (c.failed ?? 0) + (series ? (c.opened ?? 0) : 0)))
  const removed = sum(input.lamps.map((c) => c.removed ?? 0))
  if (series && failed > 0)
    out.push({
      code: 'led_section_out',
      text:
        `${failed === 1 ? '1 LED section has' : `${failed} LED sections have`} failed open: ${darkWhere(cond)}. ` +
        `Replace the failed section${failed === 1 ? '' : 's'}. ${ISOLATION_CAUTION}`,
    })
  if (removed > 0)
    out.push({
      code: 'lamp_removed',
      text:
        `${removed === 1 ? '1 LED module is' : `${removed} LED modules are`} missing: ` +
        `${series ? darkWhere(cond) : 'the rest stay lit, but the empty connector is live'}. ${ISOLATION_CAUTION}`,
    })
  if (cond.dark) {
    if (out.length === 0)
      out.push({ code: 'all_failed', text: 'Every LED module has failed: the string is dark.' })
    return out
  }
  const outParallel = series ? 0 : sum(input.lamps.map((c) => (c.failed ?? 0) + (c.opened ?? 0)))
  if (outParallel > 0)
    out.push({
      code: 'parallel_out',
      text: `${lampWord(outParallel).replace('lamp', 'LED module')} out; the others keep their supply.`,
    })
  const V = input.supplyVolts
  const lo = Math.max(...run.minVolts)
  const hi = Math.min(...run.maxVolts)
  const given = input.driverMinVolts != null || input.driverMaxVolts != null
  const band = `${volts(lo)}–${volts(hi)}${given ? '' : ', the rated voltage ± 10 % as the type gives no driver range'}`
  if (run.range === 'ok')
    out.push({
      code: 'led_in_range',
      text:
        `The supply of ${volts(V)} is within the LED driver's input range (${band}): the LEDs run at their ` +
        'rated current and the supply voltage does not shorten their life.',
    })
  else
    out.push({
      code: 'led_out_of_range',
      text:
        run.range === 'high'
          ? `The supply of ${volts(V)} is above the LED driver's input range (${band}): the driver may fail. Check the supply voltage.`
          : `The supply of ${volts(V)} is below the LED driver's input range (${band}): the LEDs may dim, flicker or go out. Check the supply voltage and the cable run.`,
    })
  return out
}

export function assessLed(input: AssessRequest): AssessResponse {
  const run = ledRun(input)
  const { cond, powerFactor: pf } = run
  const V = input.supplyVolts
  const series = (input.wiring ?? 'series') === 'series'
  const figures = run.range === 'ok'
  const litChains = cond.branches - cond.branchesDark
  const chainAmps = litChains > 0 ? run.amps / litChains : 0
  const classes = input.lamps.map((c, i) => {
    const lit = cond.lit[i] > 0
    const ratio = lit ? V / run.nominal[i] : 0
    const voltsPerLamp = ratio * c.ratedVolts
    const ampsPerLamp = figures && lit ? (series ? chainAmps : (c.ratedVolts * c.ratedAmps) / V) : null
    return {
      lampsInCircuit: cond.inCircuit[i],
      lampsLit: cond.lit[i],
      voltsPerLamp,
      ratio,
      ampsPerLamp,
      wattsPerLamp: ampsPerLamp === null ? null : voltsPerLamp * ampsPerLamp * pf,
      currentFactor: null,
      powerFactor: null,
      lightFactor: null,
      lifeFactor: null,
    }
  })
  const maxRatio = Math.max(0, ...classes.map((c) => c.ratio))
  const anyOut = input.lamps.some((c) => (c.failed ?? 0) + (c.opened ?? 0) + (c.removed ?? 0) > 0)
  // An empty socket or connector is live (trade-reference §2a): in a parallel string too.
  const removed = input.lamps.some((c) => (c.removed ?? 0) > 0)
  const replaceNow = cond.dark || run.range === 'high' || cond.branchesDark > 0 || removed
  const state: EngineState = cond.dark
    ? 'dark'
    : replaceNow
      ? 'replace'
      : anyOut || run.range === 'low'
        ? 'watch'
        : 'lit'
  const stringAmps = figures || cond.dark ? run.amps : null
  return {
    lit: !cond.dark,
    state,
    technology: 'led',
    lawsApply: false,
    stringVolts: V,
    stringAmps,
    stringWatts: stringAmps === null ? null : V * stringAmps * pf,
    powerFactor: pf,
    branches: cond.branches,
    branchesDark: cond.branchesDark,
    maxRatio,
    replaceNow,
    reasons: ledReasons(input, run),
    classes,
  }
}
