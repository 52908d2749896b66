import type { StringDetail } from '../../api/strings'
import { percent } from '../../../shared/engine/index'
import type { AssessmentView } from './assessment-view'
import { num, plural } from './string-format'

export interface KeyNumber {
  label: string
  value: string
  /** one line saying what the number was computed from */
  explain: string
}

export interface PowerLine {
  volts: string
  amps: string
  /** the LED driver's power factor, when not 1 */
  factor: string | null
  watts: string
}

/**
 * "240 V × 0.066 A = 15.84 W": the string's power as an electrician checks it, with the power factor
 * for an LED driver (the engine gives stringWatts = stringVolts × stringAmps × powerFactor). Null when
 * the engine gives no current (outside the lamp laws).
 */
export function powerLine(a: AssessmentView): PowerLine | null {
  if (a.stringAmps === null || a.stringWatts === null) return null
  const amps = a.stringAmps
  return {
    // No-break spaces keep each figure with its unit when the line wraps on a phone.
    volts: `${num(a.stringVolts, 1)}\u00a0V`,
    // Enough digits that the product checks on the page: 240 V × 0.066 A = 15.84 W (issue 11).
    amps: `${num(amps, amps < 1 ? 4 : amps < 10 ? 3 : 2)}\u00a0A`,
    factor: Math.abs(a.powerFactor - 1) > 0.005 ? num(a.powerFactor, 2) : null,
    watts: `${num(a.stringWatts, a.stringWatts < 100 ? 2 : 1)}\u00a0W`,
  }
}

// The engine's numbers for the most stressed class of lamps, each with the inputs behind it.
// Laws: current ∝ r^0.55, power ∝ r^1.6, life ∝ r^−d (Wikipedia "Lamp rerating", citing Fink & Beaty).
export function keyNumbers(s: StringDetail, a: AssessmentView): KeyNumber[] {
  const t = s.type
  const classes = a.classes.map((c, i) => ({ ...c, spec: t.classes[i] }))
  const live = classes.filter((c) => c.lampsLit > 0 && c.spec)
  if (!a.lit || live.length === 0) return []
  const top = live.reduce((m, c) => (c.ratio > m.ratio ? c : m))
  const inCircuit = live.reduce((n, c) => n + c.lampsLit, 0)
  const series = t.wiring === 'series'
  const led = t.technology === 'led'
  const sameRating = new Set(live.map((c) => `${c.spec.ratedVolts}/${c.spec.ratedAmps}`)).size === 1
  const shorted = t.classes.reduce((n, k) => n + k.count, 0) - inCircuit
  const r = `(${num(top.voltsPerLamp, 2)} ÷ ${num(top.spec.ratedVolts, 1)})`

  const chains = a.branches - a.branchesDark
  const share = !series
    ? `Each lamp sees the full ${num(a.stringVolts, 0)} V supply.`
    : a.branches > 1
      ? `${num(a.stringVolts, 0)} V across each chain, shared by its lamps still in circuit; ` +
        `${chains} of ${a.branches} chains lit.`
      : sameRating
        ? `${num(a.stringVolts, 0)} V shared by the ${plural(inCircuit, 'lamp')} still in circuit` +
          (shorted > 0
            ? `; the ${plural(shorted, 'shorted lamp')} ${shorted === 1 ? 'takes' : 'take'} none.`
            : '.')
        : `${num(a.stringVolts, 0)} V shared by the ${inCircuit} lamps in circuit at the one current they all carry; ` +
          "lamps of a different rating take a different share, so check each row's rating."

  const numbers: KeyNumber[] = [
    { label: 'Volts per lamp', value: `${num(top.voltsPerLamp, 2)} V`, explain: share },
    {
      label: 'Share of rating',
      value: percent(top.ratio),
      explain: `${num(top.voltsPerLamp, 2)} V on lamps rated ${num(top.spec.ratedVolts, 1)} V; replace now from ${percent(t.replaceAtRatio)}.`,
    },
  ]
  if (a.lawsApply && top.lifeFactor !== null && !led)
    numbers.push({
      label: 'Life factor',
      value: `× ${num(top.lifeFactor, 2)}`,
      explain: `Lamp life against running at rating: ${r}^−${t.lifeExponent}.`,
    })
  if (a.stringAmps !== null)
    numbers.push({
      label: 'String current',
      value: `${num(a.stringAmps, 3)} A`,
      explain: led
        ? 'The LED driver holds the current near its rating, whatever the supply within its range.'
        : series
          ? `One current through every lamp in a chain: rated ${num(top.spec.ratedAmps, 2)} A × ${r}^0.55` +
            (a.branches > 1 ? `, times the ${chains} chains lit.` : '.')
          : `The sum over ${plural(inCircuit, 'lamp')}, each near its rated ${num(top.spec.ratedAmps, 2)} A.`,
    })
  return numbers
}
