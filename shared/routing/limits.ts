/** Largest tour request accepted with a travel matrix (the server answers 413 beyond). */
export const MAX_STOPS_WITH_MATRIX = 1000

/** Largest tour request accepted with coordinates only (the server answers 413 beyond). */
export const MAX_STOPS_WITH_COORDINATES = 5000

/** Largest day plan accepted (a depot's crews and a day's work); the server answers 413 beyond. */
export const MAX_PLAN_CREWS = 50
export const MAX_PLAN_ITEMS = 500

/** How many of the highest-ranked open items the planning board ticks when nothing was chosen. */
export const DEFAULT_TOP_N = 12

/** Default search budget for `solveTour`; small instances stop earlier once the search stalls. */
export const DEFAULT_TIME_LIMIT_MS = 1000

/** Upper bound a caller may ask for, so one request cannot hold a server worker for long. */
export const MAX_TIME_LIMIT_MS = 30000

/** Largest tour search run on request, in stop-milliseconds (stops × time limit); larger ones are
 * refused before any work starts. 5,000,000 lets the largest coordinate request (5,000 stops) and a
 * 1,000-stop matrix run with the default 1 s limit (1,000 stops may ask for 5 s), while a request can
 * ask for the full 30 s only with up to 166 stops: a big instance holds a worker thread for a short
 * while, a long search is kept for small ones, where the solver also stops early once it stalls. */
export const MAX_TOUR_COST = 5_000_000

/** Mean Earth radius R1 = 6371008.8 m (IUGG; H. Moritz, "Geodetic Reference System 1980"). */
export const EARTH_RADIUS_M = 6371008.8

/** True when a tour request is over the stop limits (the server answers 413 rather than 400);
 * cheap enough to call before full validation of a large body. */
export function tourRequestTooLarge(body: { stops?: unknown; matrix?: unknown }): boolean {
  const count = Array.isArray(body.stops) ? body.stops.length : 0
  return count > (body.matrix === undefined ? MAX_STOPS_WITH_COORDINATES : MAX_STOPS_WITH_MATRIX)
}

/** True when a day-plan request is over the crew or item limit (413 rather than 400). */
export function planRequestTooLarge(body: { crews?: unknown; items?: unknown }): boolean {
  const crews = Array.isArray(body.crews) ? body.crews.length : 0
  const items = Array.isArray(body.items) ? body.items.length : 0
  return crews > MAX_PLAN_CREWS || items > MAX_PLAN_ITEMS
}

/** A tour request's cost in stop-milliseconds. Reads the raw body, so it can run before validation;
 * a time limit that is not a positive number counts as the default (validation refuses it anyway). */
export function tourCost(body: { stops?: unknown; timeLimitMs?: unknown }): {
  stops: number
  timeLimitMs: number
  cost: number
} {
  const stops = Array.isArray(body.stops) ? body.stops.length : 0
  const asked = body.timeLimitMs
  const timeLimitMs = typeof asked === 'number' && asked > 0 ? asked : DEFAULT_TIME_LIMIT_MS
  return { stops, timeLimitMs, cost: stops * timeLimitMs }
}
