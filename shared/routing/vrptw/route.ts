import type { VrptwModel } from './model'

/**
 * One vehicle's route with forward and backward time slack (M. W. P. Savelsbergh, "The vehicle
 * routing problem with time windows: minimizing route duration", ORSA J. Computing 4(2), 1992):
 * `early[p]` is the earliest service start at position p given everything before it, `late[p]` the
 * latest start that still lets everything after it keep its window and the depot due. Inserting or
 * joining at a position is then checked in O(1). Position 0 and the last are the vehicle's depot.
 */
export class Route {
  nodes: number[]
  early: number[] = []
  late: number[] = []
  /** demand before and including position p */
  loadTo: number[] = []
  load = 0
  cost = 0

  constructor(
    readonly m: VrptwModel,
    readonly k: number,
    stops: readonly number[] = [],
  ) {
    const d = m.n + k
    this.nodes = [d, ...stops, d]
    this.update()
  }

  get stopCount(): number {
    return this.nodes.length - 2
  }

  stops(): number[] {
    return this.nodes.slice(1, -1)
  }

  copy(): Route {
    const r = Object.create(Route.prototype) as Route
    Object.assign(r, {
      m: this.m,
      k: this.k,
      nodes: this.nodes.slice(),
      early: this.early.slice(),
      late: this.late.slice(),
      loadTo: this.loadTo.slice(),
      load: this.load,
      cost: this.cost,
    })
    return r
  }

  update(): void {
    const { m, nodes } = this
    const S = m.size
    const L = nodes.length
    this.early.length = L
    this.late.length = L
    this.loadTo.length = L
    let t = m.ready[nodes[0]]
    let load = 0
    let cost = 0
    this.early[0] = t
    this.loadTo[0] = 0
    for (let p = 1; p < L; p++) {
      const a = nodes[p - 1]
      const b = nodes[p]
      t = Math.max(t + m.service[a] + m.time[a * S + b], m.ready[b])
      this.early[p] = t
      load += m.demand[b]
      this.loadTo[p] = load
      cost += m.dist[a * S + b]
    }
    this.load = load
    this.cost = cost
    let late = m.due[nodes[L - 1]]
    this.late[L - 1] = late
    for (let p = L - 2; p >= 0; p--) {
      const a = nodes[p]
      late = Math.min(m.due[a], late - m.time[a * S + nodes[p + 1]] - m.service[a])
      this.late[p] = late
    }
  }

  /** Extra distance of putting stop x before position p (1 ≤ p < nodes.length), Infinity if infeasible. */
  insertDelta(x: number, p: number): number {
    const { m, nodes } = this
    const S = m.size
    const a = nodes[p - 1]
    const b = nodes[p]
    const start = Math.max(this.early[p - 1] + m.service[a] + m.time[a * S + x], m.ready[x])
    if (start > m.due[x]) return Infinity
    if (start + m.service[x] + m.time[x * S + b] > this.late[p]) return Infinity
    return m.dist[a * S + x] + m.dist[x * S + b] - m.dist[a * S + b]
  }

  insert(x: number, p: number): void {
    this.nodes.splice(p, 0, x)
    this.update()
  }

  removeAt(p: number): number {
    const [x] = this.nodes.splice(p, 1)
    this.update()
    return x
  }
}

/** Whether a sequence of stops is a feasible route for vehicle k (linear scan; capacity included). */
export function feasibleStops(m: VrptwModel, k: number, stops: readonly number[]): boolean {
  const S = m.size
  const d = m.n + k
  let t = m.ready[d]
  let prev = d
  let load = 0
  for (const x of stops) {
    t = Math.max(t + m.service[prev] + m.time[prev * S + x], m.ready[x])
    if (t > m.due[x]) return false
    load += m.demand[x]
    prev = x
  }
  if (load > m.capacity[k]) return false
  return t + m.service[prev] + m.time[prev * S + d] <= m.due[d]
}

/** Distance of a sequence of stops for vehicle k, depot to depot. */
export function stopsCost(m: VrptwModel, k: number, stops: readonly number[]): number {
  const S = m.size
  const d = m.n + k
  let prev = d
  let cost = 0
  for (const x of stops) {
    cost += m.dist[prev * S + x]
    prev = x
  }
  return stops.length === 0 ? 0 : cost + m.dist[prev * S + d]
}
