import {
  matrixModel,
  planarModel,
  sphereModel,
  tourCost,
  type CostModel,
  type RoundDistance,
} from './cost-model'
import { nearestNeighbourTour } from './construct'
import { EXACT_MAX_STOPS, exactTour } from './exact'
import { haversineMetres } from './geo'
import { iteratedLocalSearch } from './ils'
import { DEFAULT_TIME_LIMIT_MS, MAX_STOPS_WITH_COORDINATES, MAX_STOPS_WITH_MATRIX } from './limits'
import { candidateNeighbours } from './neighbours'
import { createRandom } from './prng'
import { greedyEdgeTour } from './tour-greedy'

export interface TourStop {
  id: string
  lat?: number
  lng?: number
  x?: number
  y?: number
}

export interface TourRequest {
  stops: TourStop[]
  /** travel cost from stop i to stop j (row i, column j), in stop order; may be asymmetric */
  matrix?: number[][]
  /** id of the stop the tour starts and ends at; defaults to the first stop */
  start?: string
  timeLimitMs?: number
}

export interface TourResult {
  order: string[]
  cost: number
}

/** Tuning and test hooks; not part of the HTTP request. */
export interface SolveOptions {
  /** applied to planar or great-circle distances during the search and in `cost`
   * (the benchmark passes TSPLIB's nint rounding) */
  roundDistance?: RoundDistance
  /** solve exactly up to this many stops (default 12; 0 forces the heuristic) */
  exactMaxStops?: number
  seed?: number
  /** kicks in a row without improvement before stopping (default scales with size) */
  stallKicks?: number
}

/**
 * Shortest closed tour through every stop (travelling-salesman heuristic): greedy-edge start
 * (nearest neighbour for asymmetric costs), then 2-opt, Or-opt, 3-opt and Lin–Kernighan moves over
 * quadrant neighbour lists, then iterated local search with local double-bridge kicks until the
 * time limit or until kicks stop paying. Deterministic while the search ends on its stall rule rather than on
 * the clock. Throws RangeError for requests `tourRequestSchema` would reject or that exceed the limits.
 */
export function solveTour(request: TourRequest, options: SolveOptions = {}): TourResult {
  const started = performance.now()
  const { stops } = request
  const n = stops.length
  const startIndex = request.start === undefined ? 0 : stops.findIndex((s) => s.id === request.start)
  if (new Set(stops.map((s) => s.id)).size !== n) throw new RangeError('stop ids must be unique')
  if (n > 0 && startIndex < 0) throw new RangeError(`start ${request.start} is not a stop`)
  const { search, report } = buildModels(request, options.roundDistance)
  if (n <= 1) return { order: stops.map((s) => s.id), cost: 0 }

  let order: Int32Array
  if (n <= (options.exactMaxStops ?? EXACT_MAX_STOPS)) {
    order = exactTour(search, startIndex)
  } else {
    const k = Math.min(10, n - 1)
    const neighbours = candidateNeighbours(search, k)
    const initial = search.symmetric
      ? greedyEdgeTour(search, neighbours, k)
      : nearestNeighbourTour(search, neighbours, k, startIndex)
    order = iteratedLocalSearch(search, initial, {
      neighbours,
      k,
      random: createRandom(options.seed ?? 0x1a4d),
      deadline: started + (request.timeLimitMs ?? DEFAULT_TIME_LIMIT_MS),
      stallKicks: options.stallKicks ?? Math.max(1000, 20 * n),
      maxKickSegment: 50,
    })
  }
  const at = order.indexOf(startIndex)
  const rotated = Int32Array.from({ length: n }, (_, i) => order[(at + i) % n])
  return { order: Array.from(rotated, (i) => stops[i].id), cost: tourCost(report, rotated) }
}

/** `search` drives the optimiser; `report` measures the answer (exact haversine for lat/lng). */
function buildModels(request: TourRequest, round?: RoundDistance): { search: CostModel; report: CostModel } {
  const { stops, matrix } = request
  const n = stops.length
  if (matrix) {
    if (n > MAX_STOPS_WITH_MATRIX)
      throw new RangeError(`at most ${MAX_STOPS_WITH_MATRIX} stops with a matrix`)
    if (matrix.length !== n || matrix.some((row) => row.length !== n)) {
      throw new RangeError('matrix must be square with one row and column per stop')
    }
    if (matrix.some((row) => row.some((v) => !Number.isFinite(v) || v < 0))) {
      throw new RangeError('matrix entries must be finite and non-negative')
    }
    const model = matrixModel(matrix)
    return { search: model, report: model }
  }
  if (n > MAX_STOPS_WITH_COORDINATES) {
    throw new RangeError(`at most ${MAX_STOPS_WITH_COORDINATES} stops with coordinates`)
  }
  const finite = (v: number | undefined): v is number => typeof v === 'number' && Number.isFinite(v)
  if (stops.every((s) => finite(s.x) && finite(s.y))) {
    const model = planarModel(
      Float64Array.from(stops, (s) => s.x as number),
      Float64Array.from(stops, (s) => s.y as number),
      round,
    )
    return { search: model, report: model }
  }
  if (stops.every((s) => finite(s.lat) && finite(s.lng))) {
    const lats = Float64Array.from(stops, (s) => s.lat as number)
    const lngs = Float64Array.from(stops, (s) => s.lng as number)
    const search = sphereModel(lats, lngs, round)
    const exact = (i: number, j: number) => {
      const d = haversineMetres(lats[i], lngs[i], lats[j], lngs[j])
      return round ? round(d) : d
    }
    return { search, report: { ...search, cost: exact } }
  }
  throw new RangeError('every stop needs x/y, or every stop lat/lng, or a matrix must be given')
}
