/**
 * Tour kept as an array of stop indices plus each stop's position. Every change is a reversal of
 * a run of positions, logged so a rejected perturbation can be undone by replaying the log
 * backwards (a reversal is its own inverse).
 */
export class ArrayTour {
  readonly n: number
  readonly order: Int32Array
  readonly pos: Int32Array
  private log: number[] = []

  /** `mayFlip`: reverse the shorter side of a 2-opt move; only valid when costs are symmetric,
   * because it reverses the reading direction of the rest of the tour. */
  constructor(
    initial: ArrayLike<number>,
    private readonly mayFlip: boolean,
  ) {
    this.n = initial.length
    this.order = Int32Array.from(initial)
    this.pos = new Int32Array(this.n)
    for (let i = 0; i < this.n; i++) this.pos[this.order[i]] = i
  }

  succ(city: number): number {
    const i = this.pos[city] + 1
    return this.order[i === this.n ? 0 : i]
  }

  pred(city: number): number {
    const i = this.pos[city]
    return this.order[i === 0 ? this.n - 1 : i - 1]
  }

  /**
   * 2-opt exchange: drop edges (a,b) and (c,d), add (a,c) and (b,d). Either b = succ(a) and
   * d = succ(c), or b = pred(a) and d = pred(c).
   */
  exchange(a: number, b: number, c: number, _d: number): void {
    if (this.succ(a) === b) this.reverse(this.pos[b], this.pos[c])
    else this.reverse(this.pos[c], this.pos[b])
  }

  /** Replaces the tour by `order` (a restart from a kept tour); forgets the log. */
  load(order: ArrayLike<number>): void {
    this.order.set(order)
    for (let i = 0; i < this.n; i++) this.pos[this.order[i]] = i
    this.log.length = 0
  }

  /** Marks the log so later changes can be undone with `undoTo`. */
  mark(): number {
    return this.log.length
  }

  /** Forgets logged changes (after an accepted perturbation). */
  commit(): void {
    this.log.length = 0
  }

  undoTo(mark: number): void {
    while (this.log.length > mark) {
      const j = this.log.pop() as number
      const i = this.log.pop() as number
      this.reverseRun(i, j)
    }
  }

  /** Reverses the cyclic run of positions from i forward to j. */
  private reverse(i: number, j: number): void {
    const n = this.n
    const len = ((j - i + n) % n) + 1
    if (this.mayFlip && 2 * len > n) {
      // The complement has the same edges reversed; cheaper to move.
      const ci = j + 1 === n ? 0 : j + 1
      const cj = i === 0 ? n - 1 : i - 1
      i = ci
      j = cj
    }
    this.log.push(i, j)
    this.reverseRun(i, j)
  }

  private reverseRun(i: number, j: number): void {
    const { n, order, pos } = this
    let steps = Math.floor((((j - i + n) % n) + 1) / 2)
    while (steps-- > 0) {
      const a = order[i]
      const b = order[j]
      order[i] = b
      pos[b] = i
      order[j] = a
      pos[a] = j
      i = i + 1 === n ? 0 : i + 1
      j = j === 0 ? n - 1 : j - 1
    }
  }
}
