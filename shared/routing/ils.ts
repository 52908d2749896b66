import { ArrayTour } from './array-tour'
import { tourCost, type CostModel } from './cost-model'
import { LocalSearch } from './local-search'
import { randomInt } from './prng'
import { doubleBridge } from './tour-kick'

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

// A kick counts as progress only when it shortens the tour by more than this share of its length:
// a fixed tolerance lets float noise from accepted sideways moves pass for gains and keep
// resetting the stall count.
const RELATIVE_GAIN = 1e-9

/**
 * Iterated local search (H. R. Lourenço, O. C. Martin and T. Stützle, "Iterated Local Search",
 * 2003): kick the local optimum with a double bridge on three short runs that follow one another
 * along the tour (`doubleBridge`), re-optimise around the eight stops it touched, and keep the
 * result unless it is longer. Runs of at most `maxKickSegment` stops keep the kick and its repair
 * local, so one kick costs about the same on 100 stops as on 5,000.
 */
export function iteratedLocalSearch(model: CostModel, initial: Int32Array, options: IlsOptions): Int32Array {
  const { n } = model
  const { random } = options
  const tour = new ArrayTour(initial, model.symmetric)
  const search = new LocalSearch(tour, model, options.neighbours, options.k)
  for (let i = 0; i < n; i++) search.push(tour.order[i])
  search.run()
  tour.commit()
  if (n < 8) return tour.order
  const minGain = RELATIVE_GAIN * tourCost(model, tour.order)
  const maxSeg = Math.max(1, Math.min(options.maxKickSegment, Math.floor((n - 2) / 3)))
  const touched = new Int32Array(8)
  const lengths: [number, number, number] = [1, 1, 1]
  const best = Int32Array.from(tour.order)
  let current = 0
  let bestCost = 0
  let stall = 0
  for (let count = 0; stall < options.stallKicks; count++) {
    if ((count & 15) === 0 && performance.now() > options.deadline) break
    const mark = tour.mark()
    const at = randomInt(random, n)
    for (let r = 0; r < 3; r++) lengths[r] = 1 + randomInt(random, maxSeg)
    let delta = doubleBridge(tour, model, at, lengths, touched)
    search.tourChanged()
    for (const city of touched) search.push(city)
    delta += search.run()
    if (delta <= 0) {
      tour.commit()
      current += delta
    } else {
      tour.undoTo(mark)
      search.tourChanged()
    }
    if (current < bestCost - minGain) {
      bestCost = current
      best.set(tour.order)
      stall = 0
    } else {
      stall++
    }
  }
  return best
}
