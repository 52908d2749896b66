// The string page's forecast, kept per process and keyed by the engine's whole input: a string whose
// state has not changed since the last read is not simulated again (2,000 trials each time before).
// The key is a hash of the request itself, so nothing is ever invalidated: a visit, a new type, a new
// schedule or another local day gives another key, and every process answers the same for a key.
// The lamps' ages grow with every burning minute; they are counted in whole burning hours here so
// that a key lasts an hour of burning rather than a millisecond. An hour is within the forecast's own
// resolution (its dates are days, its risks per 24 burning hours).
import { createHash } from 'node:crypto'
import { forecast } from '../../shared/engine/forecast'
import type { ForecastRequest, ForecastResponse } from '../../shared/schemas/engine-forecast'

/** Entries kept per process; a forecast answer is a few kB, so the cap holds a few MB at most. */
export const FORECAST_CACHE_SIZE = 2000

const entries = new Map<string, ForecastResponse>()
const stats = { hits: 0, misses: 0 }

const wholeHours = (h: number | null | undefined) => (typeof h === 'number' ? Math.round(h) : h)

/** The request with its lamp ages in whole burning hours: the request that is simulated and keyed. */
export function settledRequest(req: ForecastRequest): ForecastRequest {
  return {
    ...req,
    ...(req.lampAgeHours !== undefined ? { lampAgeHours: wholeHours(req.lampAgeHours) } : {}),
    lamps: req.lamps.map((l) => (l.ageHours === undefined ? l : { ...l, ageHours: wholeHours(l.ageHours) })),
  } as ForecastRequest
}

export function forecastKey(req: ForecastRequest): string {
  return createHash('sha1').update(JSON.stringify(req)).digest('base64url')
}

/** The forecast of `req` (lamp ages in whole hours), simulated only when this process lacks its key. */
export function cachedForecast(req: ForecastRequest): ForecastResponse {
  const settled = settledRequest(req)
  const key = forecastKey(settled)
  const hit = entries.get(key)
  if (hit) {
    stats.hits++
    // Least recently used goes first: a read moves the entry to the end of the Map's order.
    entries.delete(key)
    entries.set(key, hit)
    return hit
  }
  stats.misses++
  const result = forecast(settled)
  entries.set(key, result)
  if (entries.size > FORECAST_CACHE_SIZE) entries.delete(entries.keys().next().value as string)
  return result
}

/** Hits, misses (each one simulation) and entries held, for tests and benchmarks. */
export function forecastCacheStats() {
  return { ...stats, size: entries.size }
}

export function clearForecastCache(): void {
  entries.clear()
  stats.hits = 0
  stats.misses = 0
}
