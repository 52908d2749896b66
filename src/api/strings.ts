import type { z } from 'zod'
import type {
  mapItem,
  mapList,
  stringDetail,
  stringForecast,
  tagLookup,
  CircuitLoad,
} from '../../shared/schemas/strings'
import type { AssessResponse, ForecastResponse } from '../../shared/schemas/engine'
import { http } from './http'

export type MapItem = z.infer<typeof mapItem>
export type MapList = z.infer<typeof mapList>
export type TagLookup = z.infer<typeof tagLookup>
export type StringDetail = z.infer<typeof stringDetail>
export type StringVisit = StringDetail['visits'][number]
export type StringCertificate = StringDetail['certificates'][number]
/** minLng, minLat, maxLng, maxLat */
export type Bbox = [number, number, number, number]

// The schema leaves the engine's verdict untyped so the server may evolve it; the engine's own
// response types describe what it sends today.
export function assessmentOf(s: StringDetail): AssessResponse {
  return s.assessment as AssessResponse
}
export type StringForecastAnswer = z.infer<typeof stringForecast>
/** The engine's whole forecast (GET /strings/{id}/forecast), typed as the engine sends it today. */
export function forecastOf(a: StringForecastAnswer): ForecastResponse {
  return a.forecast as ForecastResponse
}

// Six decimals is about 0.1 m: finer only defeats the server's cache for no gain.
const coord = (n: number) => n.toFixed(6)

export const stringsApi = {
  inBox: (bbox: Bbox, signal?: AbortSignal) =>
    http.get<MapList>('/strings', { bbox: bbox.map(coord).join(',') }, signal),
  search: (q: string, signal?: AbortSignal) => http.get<MapList>('/strings', { q, limit: 40 }, signal),
  byTag: (tag: string) => http.get<TagLookup>(`/strings/by-tag/${encodeURIComponent(tag)}`),
  get: (id: number | string, signal?: AbortSignal) =>
    http.get<StringDetail>(`/strings/${encodeURIComponent(String(id))}`, undefined, signal),
  forecast: (id: number | string) =>
    http.get<StringForecastAnswer>(`/strings/${encodeURIComponent(String(id))}/forecast`),
  circuitLoad: (circuitId: number) => http.get<CircuitLoad>(`/circuits/${circuitId}/load`),
}

export type { CircuitLoad }
