import type { StringDetail } from '../../api/strings'
import type { AssessResponse } from '../../../shared/schemas/engine'
import { percent } from '../../../shared/engine/index'
import { num, plural } from './string-format'

export interface KeyNumber {
  label: string
  value: string
  /** one line saying what the number was computed from */
  explain: string
}

// The engine's numbers for the most stressed class of lamps, each with the inputs behind it.
// Laws: current ∝ r^0.55, power ∝ r^1.6, life ∝ r^−d (Wikipedia "Lamp rerating", citing Fink & Beaty).
export function keyNumbers(s: StringDetail, a: AssessResponse): KeyNumber[] {
  const t = s.type
  const classes = a.classes.map((c, i) => ({ ...c, spec: t.classes[i] }))
  const live = classes.filter((c) => c.lampsInCircuit > 0 && c.spec)
  if (!a.lit || live.length === 0) return []
  const top = live.reduce((m, c) => (c.ratio > m.ratio ? c : m))
  const inCircuit = live.reduce((n, c) => n + c.lampsInCircuit, 0)
  const series = t.wiring === 'series'
  const sameRating = new Set(live.map((c) => c.spec.ratedVolts)).size === 1
  const shorted = t.classes.reduce((n, k) => n + k.count, 0) - inCircuit
  const r = `(${num(top.voltsPerLamp, 2)} ÷ ${num(top.spec.ratedVolts, 1)})`

  const share = !series
    ? `Each lamp sees the full ${num(t.supplyVolts, 0)} V supply.`
    : sameRating
      ? `${num(t.supplyVolts, 0)} V shared by the ${plural(inCircuit, 'lamp')} still in circuit` +
        (shorted > 0
          ? `; the ${plural(shorted, 'shorted lamp')} ${shorted === 1 ? 'takes' : 'take'} none.`
          : '.')
      : `${num(t.supplyVolts, 0)} V shared in proportion to each lamp's rating among the ${inCircuit} in circuit.`

  return [
    { label: 'Volts per lamp', value: `${num(top.voltsPerLamp, 2)} V`, explain: share },
    {
      label: 'Share of rating',
      value: percent(top.ratio),
      explain: `${num(top.voltsPerLamp, 2)} V on lamps rated ${num(top.spec.ratedVolts, 1)} V; replace now from ${percent(t.replaceAtRatio)}.`,
    },
    {
      label: 'Life factor',
      value: `× ${num(top.lifeFactor, 2)}`,
      explain: `Lamp life against running at rating: ${r}^−${t.lifeExponent}.`,
    },
    {
      label: 'String current',
      value: `${num(a.stringAmps, 2)} A`,
      explain: series
        ? `One current through every lamp: rated ${num(top.spec.ratedAmps, 2)} A × ${r}^0.55.`
        : `The sum over ${plural(inCircuit, 'lamp')}, each near its rated ${num(top.spec.ratedAmps, 2)} A.`,
    },
    {
      label: 'String power',
      value: `${num(a.stringWatts, 0)} W`,
      explain: `${plural(inCircuit, 'lamp')} × rated volts × rated amps × ${r}^1.6.`,
    },
  ]
}
