import type { ArrayTour } from './array-tour'
import type { CostModel } from './cost-model'

/**
 * Double-bridge kick (O. Martin, S. W. Otto and E. W. Felten, "Large-step Markov chains for the
 * traveling salesman problem", Complex Systems 5(3), 1991; the perturbation of H. R. Lourenço,
 * O. C. Martin and T. Stützle, "Iterated Local Search", 2003): with the runs B, C, D following
 * position `at`, A B C D → A D C B. All four joins change, so no single 2-opt, Or-opt or sequential
 * 3-opt move undoes it (swapping only two neighbouring runs, A C B D, is a 3-opt move that the
 * local search would take straight back). The runs are short, so the repair stays local.
 * Returns the cost change; `touched` receives the eight stops at the joins.
 */
export function doubleBridge(
  tour: ArrayTour,
  model: CostModel,
  at: number,
  lengths: [number, number, number],
  touched: Int32Array,
): number {
  const { order, n } = tour
  const city = (offset: number) => order[(at + offset) % n]
  const [lb, lc, ld] = lengths
  const a = city(0)
  const b1 = city(1)
  const b2 = city(lb)
  const c1 = city(lb + 1)
  const c2 = city(lb + lc)
  const d1 = city(lb + lc + 1)
  const d2 = city(lb + lc + ld)
  const e = city(lb + lc + ld + 1)
  const c = model.cost
  const delta = c(a, d1) + c(d2, c1) + c(c2, b1) + c(b2, e) - (c(a, b1) + c(b2, c1) + c(c2, d1) + c(d2, e))
  // Reverse B C D as a whole, then each run back to its own direction: four 2-opt exchanges.
  tour.exchange(a, b1, d2, e)
  tour.exchange(a, d2, d1, c2)
  tour.exchange(d2, c2, c1, b2)
  tour.exchange(c2, b2, b1, e)
  touched.set([a, b1, b2, c1, c2, d1, d2, e])
  return delta
}
