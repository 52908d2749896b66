import type { ArrayTour } from './array-tour'
import type { CostModel } from './cost-model'

/**
 * Prefix sums of edge costs along the tour in both directions, so the cost change of reversing
 * any path under an asymmetric matrix is O(1) to evaluate. Rebuilt lazily (O(n)) after a change.
 */
export class PathCosts {
  private readonly forward: Float64Array
  private readonly backward: Float64Array
  private stale = true

  constructor(
    private readonly tour: ArrayTour,
    private readonly model: CostModel,
  ) {
    this.forward = new Float64Array(tour.n + 1)
    this.backward = new Float64Array(tour.n + 1)
  }

  invalidate(): void {
    this.stale = true
  }

  /** Reversed minus forward cost of the path from x forward to y. */
  reversalChange(x: number, y: number): number {
    if (this.stale) this.rebuild()
    const i = this.tour.pos[x]
    const j = this.tour.pos[y]
    const { forward: f, backward: b } = this
    const n = this.tour.n
    if (i <= j) return b[j] - b[i] - (f[j] - f[i])
    return b[n] - b[i] + b[j] - (f[n] - f[i] + f[j])
  }

  private rebuild(): void {
    const { order, n } = this.tour
    const c = this.model.cost
    for (let i = 0; i < n; i++) {
      const a = order[i]
      const z = order[i + 1 === n ? 0 : i + 1]
      this.forward[i + 1] = this.forward[i] + c(a, z)
      this.backward[i + 1] = this.backward[i] + c(z, a)
    }
    this.stale = false
  }
}
