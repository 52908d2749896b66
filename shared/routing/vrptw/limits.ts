import { MAX_TIME_LIMIT_MS } from '../limits'

/** Largest VRPTW request accepted; the server answers 413 beyond. */
export const MAX_VRPTW_STOPS = 1000

/** Default search budget of a VRPTW request. */
export const DEFAULT_VRPTW_TIME_LIMIT_MS = 2_000

export { MAX_TIME_LIMIT_MS as MAX_VRPTW_TIME_LIMIT_MS }

/** True when a VRPTW request has too many stops (413 rather than 400); reads the raw body. */
export function vrptwRequestTooLarge(body: { stops?: unknown }): boolean {
  return Array.isArray(body.stops) && body.stops.length > MAX_VRPTW_STOPS
}

/** A VRPTW request's cost in stop-milliseconds (stops × time limit), read from the raw body. */
export function vrptwCost(body: { stops?: unknown; timeLimitMs?: unknown }): {
  stops: number
  timeLimitMs: number
  cost: number
} {
  const stops = Array.isArray(body.stops) ? body.stops.length : 0
  const asked = body.timeLimitMs
  const timeLimitMs = typeof asked === 'number' && asked > 0 ? asked : DEFAULT_VRPTW_TIME_LIMIT_MS
  return { stops, timeLimitMs, cost: stops * timeLimitMs }
}
