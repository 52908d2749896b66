import type { LampClassInput } from '../schemas/engine'
import { seriesShare } from './series-share'

export type Wiring = 'series' | 'parallel'

export interface StringCondition {
  dark: boolean
  // an unshunted (fuse) lamp has failed open in a series string
  fuseFailed: boolean
  // lamps per class that have not failed; failed shunted lamps are shorts and carry no voltage
  inCircuit: number[]
  // applied / rated voltage per class; 0 for a class with no lamp in circuit and for a dark string
  ratios: number[]
}

export function lampsFailed(c: LampClassInput): number {
  return Math.min(c.failed ?? 0, c.count)
}

export function stringCondition(
  supplyVolts: number,
  lamps: LampClassInput[],
  wiring: Wiring = 'series',
): StringCondition {
  const inCircuit = lamps.map((c) => Math.max(0, c.count - lampsFailed(c)))
  const total = inCircuit.reduce((a, b) => a + b, 0)
  // In parallel a failed lamp just goes out; only in series does an open lamp break the circuit.
  const fuseFailed = wiring === 'series' && lamps.some((c) => c.shunted === false && lampsFailed(c) > 0)
  const dark = fuseFailed || total === 0
  if (dark) return { dark, fuseFailed, inCircuit, ratios: lamps.map(() => 0) }
  if (wiring === 'parallel') {
    const ratios = lamps.map((c, i) => (inCircuit[i] > 0 ? supplyVolts / c.ratedVolts : 0))
    return { dark, fuseFailed, inCircuit, ratios }
  }
  // One current through the chain, solved from each class's own rating (series-share.ts).
  const { ratios } = seriesShare(supplyVolts, lamps, inCircuit)
  return { dark, fuseFailed, inCircuit, ratios }
}
