import { CURRENT_EXPONENT } from './lamp-laws'

// One current flows through a series chain. Each lamp's voltage follows from that current through its
// own current law, I = I_rated · r^0.55 (Fink & Beaty via Wikipedia "Lamp rerating"), so
// r_i = (I / I_rated,i)^k with k = 1 / 0.55. The chain's current is the one at which the lamps'
// voltages add up to the supply:
//   Σ n_i · V_rated,i · (I / I_rated,i)^k = V  ⇒  I^k = V / S,  S = Σ n_i · V_rated,i · I_rated,i^−k
// and so r_i = V / (S · I_rated,i^k). Every class shares one exponent, so the solve is exact and
// needs no iteration. With equal rated currents it reduces to the proportional share of
// trade-reference §2: r = V / Σ n_i · V_rated,i.
export const VOLTAGE_EXPONENT = 1 / CURRENT_EXPONENT

export interface SeriesShare {
  /** the chain's current; 0 when nothing is in circuit */
  amps: number
  /** applied / rated voltage per class; 0 for a class with no lamp in circuit */
  ratios: number[]
}

export interface SeriesClass {
  ratedVolts: number
  ratedAmps: number
}

/** `I_rated^k` per class: the weight that turns a chain's S into each class's ratio. */
export function currentWeights(classes: readonly SeriesClass[]): number[] {
  return classes.map((c) => c.ratedAmps ** VOLTAGE_EXPONENT)
}

/** S = Σ n_i · V_rated,i / I_rated,i^k over the lamps in circuit. */
export function seriesSum(
  classes: readonly SeriesClass[],
  inCircuit: readonly number[],
  weights = currentWeights(classes),
): number {
  let s = 0
  for (let i = 0; i < classes.length; i++)
    if (inCircuit[i] > 0) s += (inCircuit[i] * classes[i].ratedVolts) / weights[i]
  return s
}

/** The one current and each class's ratio in a series chain across `supplyVolts`. */
export function seriesShare(
  supplyVolts: number,
  classes: readonly SeriesClass[],
  inCircuit: readonly number[],
): SeriesShare {
  const weights = currentWeights(classes)
  const s = seriesSum(classes, inCircuit, weights)
  if (!(s > 0)) return { amps: 0, ratios: classes.map(() => 0) }
  const ratios = classes.map((_, i) => (inCircuit[i] > 0 ? supplyVolts / (s * weights[i]) : 0))
  return { amps: (supplyVolts / s) ** CURRENT_EXPONENT, ratios }
}
