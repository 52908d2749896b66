import { ArrayTour } from './array-tour'
import type { CostModel } from './cost-model'
import { LocalSearch } from './local-search'
import { randomInt } from './prng'
import { doubleBridge, walkKickRuns } from './tour-kick'

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
  /** stop after this many kicks in all (a budget that does not depend on the clock) */
  maxKicks?: number
  walkSteps?: number
  restartKicks?: number
  mix?: number
  lk?: boolean
  restartAfter?: number
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
  const search = new LocalSearch(tour, model, options.neighbours, options.k, options.lk)
  for (let i = 0; i < n; i++) search.push(tour.order[i])
  search.run()
  tour.commit()
  const maxSeg = Math.max(1, Math.min(options.maxKickSegment, Math.floor((n - 2) / 3)))
  if (n < 8) return tour.order
  const touched = new Int32Array(8)
  const lengths: [number, number, number] = [1, 1, 1]
  const { random } = options
  /** One double bridge and the local search around it; returns the change in cost. */
  const kick = (alongTour: boolean): number => {
    const walk = alongTour
      ? null
      : walkKickRuns(tour, options.neighbours, options.k, random, options.walkSteps ?? 3)
    let at: number
    if (walk) {
      at = walk.at
      lengths[0] = walk.lengths[0]
      lengths[1] = walk.lengths[1]
      lengths[2] = walk.lengths[2]
    } else {
      at = randomInt(random, n)
      for (let r = 0; r < 3; r++) lengths[r] = 1 + randomInt(random, maxSeg)
    }
    const delta = doubleBridge(tour, model, at, lengths, touched)
    search.tourChanged()
    for (const city of touched) search.push(city)
    return delta + search.run()
  }
  const maxKicks = options.maxKicks ?? Infinity
  const best = Int32Array.from(tour.order)
  let current = 0
  let bestCost = 0
  const restartAfter = options.restartAfter ?? Infinity
  let sinceBest = 0
  let stall = 0
  for (let count = 0; stall < options.stallKicks && count < maxKicks; count++) {
    if ((count & 15) === 0 && performance.now() > options.deadline) break
    const mark = tour.mark()
    const delta = kick(random() < (options.mix ?? 0))
    if (delta <= 0) {
      tour.commit()
      current += delta
    } else {
      tour.undoTo(mark)
      search.tourChanged()
    }
    if (current < bestCost - 1e-9) {
      bestCost = current
      best.set(tour.order)
      stall = 0
      sinceBest = 0
    } else {
      stall++
      sinceBest++
      if (sinceBest >= restartAfter) {
        // Stuck in one valley: start again from the best tour shaken harder.
        tour.load(best)
        search.tourChanged()
        current = bestCost
        for (let r = 0; r < (options.restartKicks ?? 8); r++) current += kick(true)
        tour.commit()
        sinceBest = 0
      }
    }
  }
  return best
}
