import type { ArrayTour } from './array-tour'
import type { CostModel } from './cost-model'

/**
 * Sequential 3-opt moves over neighbour lists, for symmetric costs: the depth-3 step of
 * Lin–Kernighan (S. Lin and B. W. Kernighan, "An Effective Heuristic Algorithm for the
 * Traveling-Salesman Problem", Operations Research 21(2), 1973) as used by D. S. Johnson and
 * L. A. McGeoch ("The Traveling Salesman Problem: A Case Study in Local Optimization", 1997, §3).
 * Drop (t1,t2), (t3,t4), (t5,t6); add (t2,t3), (t4,t5), (t6,t1). t3 is a near neighbour of t2 and
 * t5 of t4, and each partial sum must stay a gain (the LK gain criterion), so a scan is O(k²).
 * Besides 2-opt it finds every "segment insertion" (Or-3opt: a run of any length moved elsewhere,
 * either way round) and the pure segment swap A B C → A C B that 2-opt cannot undo.
 */
export class ThreeOptScan {
  private bestGain = 0
  /** t1…t6 of the best move found, and which of the three closing shapes it is */
  private readonly t = new Int32Array(6)
  private shape = 0

  constructor(
    private readonly tour: ArrayTour,
    private readonly model: CostModel,
    private readonly neighbours: Int32Array,
    private readonly k: number,
  ) {}

  /** Finds the best move from t1 that gains more than `minGain`; returns its gain (0 if none). */
  scan(t1: number, minGain: number): number {
    const { neighbours, k } = this
    const c = this.model.cost
    this.bestGain = minGain
    this.shape = 0
    for (let dir = 0; dir < 2; dir++) {
      const t2 = this.next(t1, dir)
      const d12 = c(t1, t2)
      for (let i = t2 * k; i < t2 * k + k; i++) {
        const t3 = neighbours[i]
        const g1 = d12 - c(t2, t3)
        if (g1 <= 0) break
        if (t3 === t1 || t3 === this.next(t2, dir)) continue
        // t4 before t3: closing at once is 2-opt; else t5 anywhere, t6 on t4's side of t5.
        let t4 = this.prev(t3, dir)
        let g2 = g1 + c(t3, t4)
        this.consider(1, t1, t2, t3, t4, t4, t1, g2 - c(t4, t1))
        for (let j = t4 * k; j < t4 * k + k; j++) {
          const t5 = neighbours[j]
          const g2a = g2 - c(t4, t5)
          if (g2a <= 0) break
          if (t5 === t3 || t5 === t1) continue
          const t6 = this.between(t2, t5, t4, dir) ? this.next(t5, dir) : this.prev(t5, dir)
          if (t6 === t4) continue
          this.consider(2, t1, t2, t3, t4, t5, t6, g2a + c(t5, t6) - c(t6, t1))
        }
        // t4 after t3: (t2,t3) closes the run t2…t3 into a loop, so t5 must lie on it.
        t4 = this.next(t3, dir)
        if (t4 === t1) continue
        g2 = g1 + c(t3, t4)
        for (let j = t4 * k; j < t4 * k + k; j++) {
          const t5 = neighbours[j]
          const g2a = g2 - c(t4, t5)
          if (g2a <= 0) break
          if (t5 === t3 || !this.between(t2, t5, t3, dir)) continue
          if (t5 !== t3) {
            const t6 = this.next(t5, dir)
            this.consider(3, t1, t2, t3, t4, t5, t6, g2a + c(t5, t6) - c(t6, t1))
          }
          if (t5 !== t2) {
            const t6 = this.prev(t5, dir)
            this.consider(4, t1, t2, t3, t4, t5, t6, g2a + c(t5, t6) - c(t6, t1))
          }
        }
      }
    }
    return this.shape === 0 ? 0 : this.bestGain
  }

  /** Applies the move last found by `scan` as 2-opt exchanges; returns the stops it touched. */
  apply(): Int32Array {
    const { tour, t } = this
    const [t1, t2, t3, t4, t5, t6] = t
    switch (this.shape) {
      case 1: // 2-opt
        tour.exchange(t1, t2, t4, t3)
        break
      case 2: // 2-opt, then a second 2-opt through the new edge (t1,t4)
        tour.exchange(t1, t2, t4, t3)
        tour.exchange(t1, t4, t6, t5)
        break
      case 3: // t1 [t2…t5][t6…t3] t4 → t1 [t6…t3][t2…t5] t4: three reversals
        tour.exchange(t1, t2, t5, t6)
        tour.exchange(t1, t5, t3, t4)
        tour.exchange(t1, t3, t6, t2)
        break
      case 4: // t1 [t2…t6][t5…t3] t4 → both runs reversed in place
        tour.exchange(t1, t2, t6, t5)
        tour.exchange(t2, t5, t3, t4)
        break
      default:
        return new Int32Array(0)
    }
    return this.shape === 1 ? t.subarray(0, 4) : t
  }

  private consider(
    shape: number,
    t1: number,
    t2: number,
    t3: number,
    t4: number,
    t5: number,
    t6: number,
    gain: number,
  ): void {
    if (gain <= this.bestGain) return
    this.bestGain = gain
    this.shape = shape
    const { t } = this
    t[0] = t1
    t[1] = t2
    t[2] = t3
    t[3] = t4
    t[4] = t5
    t[5] = t6
  }

  private next(city: number, dir: number): number {
    return dir === 0 ? this.tour.succ(city) : this.tour.pred(city)
  }

  private prev(city: number, dir: number): number {
    return dir === 0 ? this.tour.pred(city) : this.tour.succ(city)
  }

  /** True when b lies on the path from a to c, walking in direction `dir`. */
  private between(a: number, b: number, c: number, dir: number): boolean {
    if (dir === 1) [a, c] = [c, a]
    const { pos } = this.tour
    const pa = pos[a]
    const pb = pos[b]
    const pc = pos[c]
    return pa <= pc ? pa <= pb && pb <= pc : pb >= pa || pb <= pc
  }
}
