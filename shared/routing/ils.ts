import { ArrayTour } from './array-tour'
import type { CostModel } from './cost-model'
import { LocalSearch } from './local-search'
import { randomInt } from './prng'

export interface IlsOptions {
  neighbours: Int32Array
  k: number
  random: () => number
  /** performance.now() value after which no further kick is started */
  deadline: number
  /** stop after this many kicks in a row without a strictly shorter tour */
  stallKicks: number
  /** longest run moved by one kick */
  maxKickSegment: number
}

/**
 * Iterated local search (H. R. Lourenço, O. C. Martin and T. Stützle, "Iterated Local Search",
 * 2003): kick the local optimum with a double bridge, A B C D → A C B D (O. Martin, S. W. Otto and
 * E. W. Felten, "Large-step Markov chains for the traveling salesman problem", 1991), a change
 * 2-opt and Or-opt rarely undo; B and C are kept short so the repair stays local and cheap. Re-optimise around the kick and keep the result unless it is longer.
 */
export function iteratedLocalSearch(model: CostModel, initial: Int32Array, options: IlsOptions): Int32Array {
  const { n } = model
  const tour = new ArrayTour(initial, model.symmetric)
  const search = new LocalSearch(tour, model, options.neighbours, options.k)
  for (let i = 0; i < n; i++) search.push(tour.order[i])
  search.run()
  tour.commit()
  const maxSeg = Math.max(1, Math.min(options.maxKickSegment, Math.floor((n - 3) / 2)))
  if (n < 8) return tour.order
  let stall = 0
  for (let kick = 0; stall < options.stallKicks; kick++) {
    if ((kick & 15) === 0 && performance.now() > options.deadline) break
    const i = randomInt(options.random, n)
    const len1 = 1 + randomInt(options.random, maxSeg)
    const len2 = 1 + randomInt(options.random, maxSeg)
    const { order } = tour
    const first = order[(i + 1) % n]
    const last = order[(i + len1) % n]
    const u = order[(i + len1 + len2) % n]
    const v = order[(i + len1 + len2 + 1) % n]
    const mark = tour.mark()
    let delta = search.orDelta(first, last, u, v, false)
    search.orMove(first, last, u, v, false)
    delta += search.run()
    if (delta <= 0) {
      tour.commit()
      stall = delta < -1e-9 ? 0 : stall + 1
    } else {
      tour.undoTo(mark)
      search.tourChanged()
      stall++
    }
  }
  return tour.order
}
