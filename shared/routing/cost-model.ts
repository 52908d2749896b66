import { EARTH_RADIUS_M } from './limits'
import { unitVectors } from './geo'

/** How the optimiser sees an instance: directed costs between stop indices. */
export interface CostModel {
  n: number
  /** true when cost(i, j) === cost(j, i) for all pairs, so segments may be reversed freely */
  symmetric: boolean
  cost: (i: number, j: number) => number
  /** symmetric ranking key for neighbour lists (smaller is nearer); need not be a distance */
  near: (i: number, j: number) => number
  /** quadrant (0–3) around stop i that stop j lies in, for candidate lists; absent for matrices */
  quadrant?: (i: number, j: number) => number
}

export type RoundDistance = (distance: number) => number

// Above this a full matrix of great-circle distances costs more memory than it saves time.
const PRECOMPUTE_LIMIT = 1000

export function matrixModel(rows: number[][]): CostModel {
  const n = rows.length
  const flat = new Float64Array(n * n)
  let symmetric = true
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) flat[i * n + j] = rows[i][j]
  for (let i = 0; i < n && symmetric; i++) {
    for (let j = i + 1; j < n; j++) {
      if (flat[i * n + j] !== flat[j * n + i]) {
        symmetric = false
        break
      }
    }
  }
  return {
    n,
    symmetric,
    cost: (i, j) => flat[i * n + j],
    near: (i, j) => flat[i * n + j] + flat[j * n + i],
  }
}

export function planarModel(xs: Float64Array, ys: Float64Array, round?: RoundDistance): CostModel {
  const n = xs.length
  const euclid = (i: number, j: number) => {
    const dx = xs[i] - xs[j]
    const dy = ys[i] - ys[j]
    return Math.sqrt(dx * dx + dy * dy)
  }
  const near = (i: number, j: number) => {
    const dx = xs[i] - xs[j]
    const dy = ys[i] - ys[j]
    return dx * dx + dy * dy
  }
  const quadrant = (i: number, j: number) => quadrantOf(xs[j] - xs[i], ys[j] - ys[i])
  return { n, symmetric: true, cost: round ? (i, j) => round(euclid(i, j)) : euclid, near, quadrant }
}

export function sphereModel(lats: Float64Array, lngs: Float64Array, round?: RoundDistance): CostModel {
  const n = lats.length
  const u = unitVectors(lats, lngs)
  const chord2 = (i: number, j: number) => {
    const dx = u[3 * i] - u[3 * j]
    const dy = u[3 * i + 1] - u[3 * j + 1]
    const dz = u[3 * i + 2] - u[3 * j + 2]
    return dx * dx + dy * dy + dz * dz
  }
  const arc = (i: number, j: number) => {
    const d = 2 * EARTH_RADIUS_M * Math.asin(Math.min(1, Math.sqrt(chord2(i, j)) / 2))
    return round ? round(d) : d
  }
  // East and north at each stop: the chord to another stop, projected on them, gives its bearing.
  const east = new Float64Array(2 * n)
  const north = new Float64Array(3 * n)
  for (let i = 0; i < n; i++) {
    const [x, y, z] = [u[3 * i], u[3 * i + 1], u[3 * i + 2]]
    const r = Math.hypot(x, y)
    // At a pole every direction is south (or north); any fixed meridian will do.
    east[2 * i] = r > 0 ? -y / r : 0
    east[2 * i + 1] = r > 0 ? x / r : 1
    north[3 * i] = r > 0 ? (-z * x) / r : -z
    north[3 * i + 1] = r > 0 ? (-z * y) / r : 0
    north[3 * i + 2] = r
  }
  const quadrant = (i: number, j: number) => {
    const dx = u[3 * j] - u[3 * i]
    const dy = u[3 * j + 1] - u[3 * i + 1]
    const dz = u[3 * j + 2] - u[3 * i + 2]
    const e = dx * east[2 * i] + dy * east[2 * i + 1]
    return quadrantOf(e, dx * north[3 * i] + dy * north[3 * i + 1] + dz * north[3 * i + 2])
  }
  if (n > PRECOMPUTE_LIMIT) return { n, symmetric: true, cost: arc, near: chord2, quadrant }
  const flat = new Float64Array(n * n)
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) flat[i * n + j] = flat[j * n + i] = arc(i, j)
  }
  return { n, symmetric: true, cost: (i, j) => flat[i * n + j], near: chord2, quadrant }
}

/** Quadrant of the offset (dx, dy): 0 north-east, 1 north-west, 2 south-west, 3 south-east; each
 * takes one of its bounding half-axes, so a point straight east, north, west or south has one. */
export function quadrantOf(dx: number, dy: number): number {
  if (dx >= 0 && dy > 0) return 0
  if (dx < 0 && dy >= 0) return 1
  if (dx <= 0 && dy < 0) return 2
  return dx > 0 ? 3 : 0
}

/** Closed-tour cost of a permutation of stop indices under the model. */
export function tourCost(model: CostModel, order: ArrayLike<number>): number {
  let total = 0
  for (let k = 0; k < order.length; k++) total += model.cost(order[k], order[(k + 1) % order.length])
  return total
}
