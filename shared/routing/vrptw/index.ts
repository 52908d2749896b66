import { searchVrptw } from './alns'
import { DEFAULT_VRPTW_TIME_LIMIT_MS } from './limits'
import { planarModel } from './model'

export type { VrptwModel } from './model'
export { searchVrptw, type SearchOptions, type SearchResult } from './alns'

export interface VrptwStop {
  id: string
  x: number
  y: number
  demand: number
  ready: number
  due: number
  service: number
}

export interface VrptwRequest {
  depot: { x: number; y: number; ready: number; due: number }
  vehicles: { count: number; capacity: number }
  stops: VrptwStop[]
  timeLimitMs?: number
  seed?: number
  /** iteration budget: with it (and a time limit that is not reached) the answer depends only on the seed */
  maxIterations?: number
}

export type VrptwUnservedReason = 'unreachable' | 'no_room'

export interface VrptwResult {
  /** stop ids in visiting order, one list per route used (empty routes are left out) */
  routes: string[][]
  /** total Euclidean distance, depot to depot */
  distance: number
  unserved: { id: string; reason: VrptwUnservedReason }[]
}

/**
 * Vehicle routing with time windows on the plane (Solomon's conventions): at most
 * `vehicles.count` routes from the depot, minimising unserved stops, then total distance.
 * `clock` replaces the wall clock for the time limit (the benchmark measures CPU time).
 */
export function solveVrptw(req: VrptwRequest, clock?: { now: () => number }): VrptwResult {
  const m = planarModel(req.depot, req.vehicles, req.stops)
  const { solution, unreachable } = searchVrptw(m, {
    seed: req.seed,
    timeLimitMs: req.timeLimitMs ?? DEFAULT_VRPTW_TIME_LIMIT_MS,
    maxIterations: req.maxIterations,
    now: clock?.now,
  })
  const gone = new Set(unreachable)
  return {
    routes: solution.routes.filter((r) => r.stopCount > 0).map((r) => r.stops().map((i) => req.stops[i].id)),
    distance: solution.distance(),
    unserved: [...unreachable, ...solution.unserved]
      .sort((a, b) => a - b)
      .map((i) => ({ id: req.stops[i].id, reason: gone.has(i) ? 'unreachable' : 'no_room' })),
  }
}
