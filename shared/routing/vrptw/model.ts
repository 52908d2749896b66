/**
 * The VRPTW engine's numeric view of an instance. Node i < n is stop i; node n + k is vehicle k's
 * depot (where it starts and ends). Times are in the same unit as `time`; arriving before `ready`
 * means waiting, service must start by `due`; at a depot node `ready`/`due` are the vehicle's
 * leaving and latest return times.
 */
export interface VrptwModel {
  /** stops */
  n: number
  /** vehicles (at most this many routes) */
  v: number
  /** n + v */
  size: number
  /** cost of going from a to b at [a * size + b] (the distance being minimised) */
  dist: Float64Array
  /** travel time from a to b at [a * size + b] */
  time: Float64Array
  ready: Float64Array
  due: Float64Array
  service: Float64Array
  demand: Float64Array
  capacity: Float64Array
  /** stop i allowed on vehicle k at [k * n + i]; null when every stop fits every vehicle */
  allowed: Uint8Array | null
  /** weight of leaving stop i unserved (≥ 1); the objective minimises the weighted count first */
  weight: Float64Array
  /** vehicles with the same end group end at the same place by the same time (2-opt* allowed) */
  endGroup: Int32Array
  /** vehicles of the same class are interchangeable (same depot, times, capacity, stops allowed) */
  vehicleClass: Int32Array
}

export interface PlanarDepot {
  x: number
  y: number
  ready: number
  due: number
}

export interface PlanarStop {
  x: number
  y: number
  demand: number
  ready: number
  due: number
  service: number
}

/** Euclidean distance = travel time in double precision, one shared depot (Solomon's conventions). */
export function planarModel(
  depot: PlanarDepot,
  vehicles: { count: number; capacity: number },
  stops: readonly PlanarStop[],
): VrptwModel {
  const n = stops.length
  const v = vehicles.count
  const size = n + v
  const xs = new Float64Array(size)
  const ys = new Float64Array(size)
  const ready = new Float64Array(size)
  const due = new Float64Array(size)
  const service = new Float64Array(size)
  const demand = new Float64Array(size)
  stops.forEach((s, i) => {
    xs[i] = s.x
    ys[i] = s.y
    ready[i] = s.ready
    due[i] = s.due
    service[i] = s.service
    demand[i] = s.demand
  })
  for (let k = 0; k < v; k++) {
    xs[n + k] = depot.x
    ys[n + k] = depot.y
    ready[n + k] = depot.ready
    due[n + k] = depot.due
  }
  const dist = new Float64Array(size * size)
  for (let a = 0; a < size; a++) {
    for (let b = 0; b < size; b++) dist[a * size + b] = Math.hypot(xs[a] - xs[b], ys[a] - ys[b])
  }
  return {
    n,
    v,
    size,
    dist,
    time: dist,
    ready,
    due,
    service,
    demand,
    capacity: new Float64Array(v).fill(vehicles.capacity),
    allowed: null,
    weight: new Float64Array(n).fill(1),
    endGroup: new Int32Array(v),
    vehicleClass: new Int32Array(v),
  }
}

export const isAllowed = (m: VrptwModel, k: number, i: number): boolean =>
  m.allowed === null || m.allowed[k * m.n + i] === 1

/** Whether stop i can be served by vehicle k as its only stop. */
export function servableAlone(m: VrptwModel, k: number, i: number): boolean {
  if (!isAllowed(m, k, i) || m.demand[i] > m.capacity[k]) return false
  const d = m.n + k
  const start = Math.max(m.ready[d] + m.time[d * m.size + i], m.ready[i])
  if (start > m.due[i]) return false
  return start + m.service[i] + m.time[i * m.size + d] <= m.due[d]
}
