import type { ArrayTour } from './array-tour'
import type { CostModel } from './cost-model'
import { PathCosts } from './path-costs'
import { LinKernighanStep } from './tour-lk'
import { ThreeOptScan } from './tour-three-opt'

// Smallest gain worth a move: guards against looping on floating-point noise.
const MIN_GAIN = 1e-9
const MAX_SEGMENT = 3

/**
 * 2-opt plus Or-opt (segments of 1–3 stops moved elsewhere, either way round) over neighbour
 * lists, with a work queue standing in for don't-look bits (J. L. Bentley, "Fast Algorithms for
 * Geometric Traveling Salesman Problems", ORSA J. Computing 4(4), 1992): only stops next to a
 * changed edge are looked at again. For symmetric costs a sequential 3-opt scan competes with
 * them, and when none of the three finds a move a Lin–Kernighan chain is tried. Costs are
 * directed; for asymmetric matrices a reversed path is charged its reversed cost and the tour
 * array never flips its reading direction.
 */
export class LocalSearch {
  private readonly queue: Int32Array
  private readonly queued: Uint8Array
  private head = 0
  private size = 0
  private readonly paths: PathCosts | null
  private readonly threeOpt: ThreeOptScan | null
  private readonly lk: LinKernighanStep | null
  private readonly seg = new Int32Array(MAX_SEGMENT)
  private bestDelta = 0
  private best: number[] = []

  constructor(
    private readonly tour: ArrayTour,
    private readonly model: CostModel,
    private readonly neighbours: Int32Array,
    private readonly k: number,
  ) {
    this.queue = new Int32Array(tour.n)
    this.queued = new Uint8Array(tour.n)
    this.paths = model.symmetric ? null : new PathCosts(tour, model)
    this.threeOpt = model.symmetric ? new ThreeOptScan(tour, model, neighbours, k) : null
    this.lk = model.symmetric ? new LinKernighanStep(tour, model, neighbours, k) : null
  }

  push(city: number): void {
    if (this.queued[city]) return
    this.queued[city] = 1
    this.queue[(this.head + this.size) % this.queue.length] = city
    this.size++
  }

  /** Tells the search the tour was changed behind its back (an undone perturbation). */
  tourChanged(): void {
    this.paths?.invalidate()
  }

  /** Improves until no queued stop has an improving move; returns the total change in cost. */
  run(): number {
    let total = 0
    while (this.size > 0) {
      const a = this.queue[this.head]
      this.head = (this.head + 1) % this.queue.length
      this.size--
      this.queued[a] = 0
      total += this.improve(a)
    }
    return total
  }

  /** Cost change of moving the run first..last between u and v = succ(u). */
  orDelta(first: number, last: number, u: number, v: number, reversed: boolean): number {
    const { tour } = this
    const c = this.model.cost
    const p = tour.pred(first)
    const nx = tour.succ(last)
    const removed = c(p, first) + c(last, nx) + c(u, v) - c(p, nx)
    if (!reversed) return c(u, first) + c(last, v) - removed
    let inner = 0
    if (this.paths)
      for (let x = first; x !== last; x = tour.succ(x)) inner += c(tour.succ(x), x) - c(x, tour.succ(x))
    return c(u, last) + c(first, v) + inner - removed
  }

  /** Moves the run first..last (tour order) between u and v = succ(u), as two or three exchanges. */
  orMove(first: number, last: number, u: number, v: number, reversed: boolean): void {
    const { tour } = this
    const p = tour.pred(first)
    const nx = tour.succ(last)
    if (v !== p) {
      tour.exchange(p, first, u, v)
      if (u !== nx) tour.exchange(p, u, nx, last)
    } else {
      tour.exchange(u, p, last, nx)
    }
    if (!reversed && first !== last) tour.exchange(u, last, first, v)
    this.paths?.invalidate()
    for (const city of [p, nx, first, last, u, v]) this.push(city)
  }

  private improve(a: number): number {
    this.bestDelta = -MIN_GAIN
    this.best = []
    this.scanTwoOpt(a)
    this.scanOrOpt(a)
    if (this.threeOpt) {
      const gain = this.threeOpt.scan(a, -this.bestDelta)
      if (gain > 0) {
        for (const city of this.threeOpt.apply()) this.push(city)
        return -gain
      }
    }
    const move = this.best
    if (move.length === 0 && this.lk) {
      const gain = this.lk.run(a)
      if (gain > 0) for (const city of this.lk.touched) this.push(city)
      return -gain
    }
    if (move.length === 0) return 0
    const delta = this.bestDelta
    if (move.length === 4) {
      this.tour.exchange(move[0], move[1], move[2], move[3])
      this.paths?.invalidate()
      for (const city of move) this.push(city)
    } else {
      this.orMove(move[0], move[1], move[2], move[3], move[4] === 1)
    }
    return delta
  }

  private scanTwoOpt(a: number): void {
    const { tour, neighbours, k } = this
    const c = this.model.cost
    for (let dir = 0; dir < 2; dir++) {
      const b = dir === 0 ? tour.succ(a) : tour.pred(a)
      const dab = dir === 0 ? c(a, b) : c(b, a)
      for (let i = a * k; i < a * k + k; i++) {
        const x = neighbours[i]
        const dax = dir === 0 ? c(a, x) : c(x, a)
        if (dax >= dab) break
        const y = dir === 0 ? tour.succ(x) : tour.pred(x)
        if (x === b || y === a) continue
        let delta: number
        if (dir === 0) {
          delta = dax + c(b, y) - dab - c(x, y)
          if (this.paths) delta += this.paths.reversalChange(b, x)
        } else {
          delta = dax + c(y, b) - dab - c(y, x)
          if (this.paths) delta += this.paths.reversalChange(x, b)
        }
        if (delta < this.bestDelta) {
          this.bestDelta = delta
          this.best = [a, b, x, y]
        }
      }
    }
  }

  private scanOrOpt(a: number): void {
    const { tour, neighbours, k, seg } = this
    const c = this.model.cost
    const maxLen = Math.min(MAX_SEGMENT, tour.n - 4)
    for (let end = 0; end < 2; end++) {
      // end 0: a starts the run; end 1: a finishes it.
      let other = a
      for (let len = 1; len <= maxLen; len++) {
        if (len > 1) other = end === 0 ? tour.succ(other) : tour.pred(other)
        seg[len - 1] = other
        const first = end === 0 ? a : other
        const last = end === 0 ? other : a
        const p = tour.pred(first)
        const nx = tour.succ(last)
        const gain = c(p, first) + c(last, nx) - c(p, nx)
        if (gain <= MIN_GAIN) continue
        for (let i = a * k; i < a * k + k; i++) {
          const x = neighbours[i]
          if (Math.min(c(a, x), c(x, a)) >= gain) break
          if (this.inRun(x, len)) continue
          this.tryInsert(first, last, len, x, tour.succ(x))
          this.tryInsert(first, last, len, tour.pred(x), x)
        }
      }
    }
  }

  private tryInsert(first: number, last: number, len: number, u: number, v: number): void {
    if (this.inRun(u, len) || this.inRun(v, len)) return
    for (let r = 0; r < (len === 1 ? 1 : 2); r++) {
      const delta = this.orDelta(first, last, u, v, r === 1)
      if (delta < this.bestDelta) {
        this.bestDelta = delta
        this.best = [first, last, u, v, r]
      }
    }
  }

  private inRun(city: number, len: number): boolean {
    for (let i = 0; i < len; i++) if (this.seg[i] === city) return true
    return false
  }
}
