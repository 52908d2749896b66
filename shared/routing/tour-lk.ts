import type { ArrayTour } from './array-tour'
import type { CostModel } from './cost-model'

const MAX_DEPTH = 10
const FIRST_BREADTH = 5
const MIN_GAIN = 1e-9

/**
 * A Lin–Kernighan step for symmetric costs (S. Lin and B. W. Kernighan, Operations Research 21(2),
 * 1973), as a chain of 2-opt flips in the manner of D. S. Johnson and L. A. McGeoch (1997, §4):
 * drop (t1,t2), join t2 to a near t3, drop the edge (t4,t3) that keeps a tour when closed by
 * (t4,t1), and carry on from t4 while the running gain stays positive, up to MAX_DEPTH flips. The
 * longest prefix with the best closed gain is kept, the rest undone. Tried after 3-opt finds nothing,
 * it reaches the deeper moves 3-opt misses. A stop joins the chain at most once.
 */
export class LinKernighanStep {
  private readonly used: Uint8Array
  private readonly chain: number[] = []
  readonly touched: number[] = []

  constructor(
    private readonly tour: ArrayTour,
    private readonly model: CostModel,
    private readonly neighbours: Int32Array,
    private readonly k: number,
  ) {
    this.used = new Uint8Array(tour.n)
  }

  /** Improves the tour from t1 if a chain gains; returns the gain (0, tour unchanged, if none). */
  run(t1: number): number {
    const { tour, neighbours, k } = this
    const c = this.model.cost
    for (let side = 0; side < 2; side++) {
      const t2 = side === 0 ? tour.succ(t1) : tour.pred(t1)
      const open = c(t1, t2)
      let tried = 0
      for (let i = t2 * k; i < t2 * k + k && tried < FIRST_BREADTH; i++) {
        const t3 = neighbours[i]
        if (open - c(t2, t3) <= MIN_GAIN) break
        if (t3 === t1 || t3 === tour.succ(t2) || t3 === tour.pred(t2)) continue
        tried++
        const gain = this.chainFrom(t1, t2, t3, open)
        if (gain > 0) return gain
      }
    }
    return 0
  }

  /** Flips from the first choice t3 onwards; keeps the best closed prefix. */
  private chainFrom(t1: number, t2: number, t3: number, open: number): number {
    const { tour, neighbours, k, used, chain } = this
    const c = this.model.cost
    const start = tour.mark()
    let bestGain = MIN_GAIN
    let bestMark = -1
    let bestLength = 0
    chain.length = 0
    used[t1] = used[t2] = 1
    chain.push(t1, t2)
    for (let depth = 0; depth < MAX_DEPTH && t3 >= 0; depth++) {
      const forward = tour.succ(t1) === t2
      const t4 = forward ? tour.pred(t3) : tour.succ(t3)
      tour.exchange(t1, t2, t4, t3)
      open += c(t3, t4) - c(t2, t3)
      used[t3] = used[t4] = 1
      chain.push(t3, t4)
      const closed = open - c(t4, t1)
      if (closed > bestGain) {
        bestGain = closed
        bestMark = tour.mark()
        bestLength = chain.length
      }
      t2 = t4
      // Next t3: the near stop of t2 that leaves the most to gain, g − c(t2,t3) + c(t3,t4).
      t3 = -1
      let score = -Infinity
      for (let i = t2 * k; i < t2 * k + k; i++) {
        const x = neighbours[i]
        const rest = open - c(t2, x)
        if (rest <= MIN_GAIN) break
        if (used[x] || x === tour.succ(t2) || x === tour.pred(t2)) continue
        const y = tour.succ(t1) === t2 ? tour.pred(x) : tour.succ(x)
        if (used[y]) continue
        if (rest + c(x, y) > score) {
          score = rest + c(x, y)
          t3 = x
        }
      }
    }
    for (const city of chain) used[city] = 0
    tour.undoTo(bestMark < 0 ? start : bestMark)
    if (bestMark < 0) return 0
    this.touched.length = 0
    for (let i = 0; i < bestLength; i++) this.touched.push(chain[i])
    return bestGain
  }
}
