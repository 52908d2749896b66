import { haversineMetres } from './geo'
import type { PlanInput } from './plan-types'

export const DEFAULT_SPEED_KMH = 25
export const DEFAULT_DETOUR_FACTOR = 1.4
const DAY = 24 * 60

/**
 * The planner's numeric view: node c < C is crew c's depot, node C + i is item i. Times are whole
 * minutes from midnight of the shift day; travel is rounded up to whole minutes so displayed times
 * add up and never promise an earlier arrival than the estimate.
 */
export interface PlanModel {
  crewCount: number
  itemCount: number
  travel: Float64Array
  shiftStart: Float64Array
  shiftEnd: Float64Array
  service: Float64Array
  /** allowed start window of item i for crew c at [c * itemCount + i] */
  from: Float64Array
  to: Float64Array
  /** platform and pin rules allow crew c to do item i */
  allowed: Uint8Array
  pinnedCrew: Int32Array
  priority: Float64Array
}

export function parseClock(hhmm: string): number {
  const [h, m] = hhmm.split(':').map(Number)
  return h * 60 + m
}

export function formatClock(minutes: number): string {
  const m = ((Math.round(minutes) % DAY) + DAY) % DAY
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`
}

export function buildPlanModel(input: PlanInput): PlanModel {
  const { crews, items } = input
  const C = crews.length
  const I = items.length
  const N = C + I
  const crewIndex = new Map(crews.map((c, i) => [c.id, i]))
  const travel = new Float64Array(N * N)
  const matrix = input.settings?.matrixMinutes
  const speed = input.settings?.speedKmh ?? DEFAULT_SPEED_KMH
  const detour = input.settings?.detourFactor ?? DEFAULT_DETOUR_FACTOR
  const place = (k: number) => (k < C ? crews[k].depot : items[k - C])
  for (let a = 0; a < N; a++) {
    for (let b = 0; b < N; b++) {
      if (a === b) continue
      // Road distance ≈ great-circle distance × detour factor (common practice, no source).
      const minutes = matrix
        ? matrix[a][b]
        : ((haversineMetres(place(a).lat, place(a).lng, place(b).lat, place(b).lng) / 1000) * detour * 60) /
          speed
      travel[a * N + b] = Math.ceil(minutes - 1e-9)
    }
  }
  const shiftStart = Float64Array.from(crews, (c) => parseClock(c.shiftStart))
  const shiftEnd = Float64Array.from(crews, (c, k) => {
    const end = parseClock(c.shiftEnd)
    return end <= shiftStart[k] ? end + DAY : end
  })
  const from = new Float64Array(C * I)
  const to = new Float64Array(C * I)
  const allowed = new Uint8Array(C * I)
  const pinnedCrew = Int32Array.from(items, (item) => {
    if (item.pinnedCrewId === undefined) return -1
    const k = crewIndex.get(item.pinnedCrewId)
    if (k === undefined)
      throw new RangeError(`item ${item.id} is pinned to unknown crew ${item.pinnedCrewId}`)
    return k
  })
  for (let c = 0; c < C; c++) {
    for (let i = 0; i < I; i++) {
      const item = items[i]
      const [lo, hi] = item.window ? windowFor(item.window, shiftStart[c]) : [-Infinity, Infinity]
      from[c * I + i] = lo
      to[c * I + i] = hi
      const platformOk = !item.needsPlatform || crews[c].hasPlatform
      allowed[c * I + i] = platformOk && (pinnedCrew[i] < 0 || pinnedCrew[i] === c) ? 1 : 0
    }
  }
  return {
    crewCount: C,
    itemCount: I,
    travel,
    shiftStart,
    shiftEnd,
    service: Float64Array.from(items, (item) => item.serviceMinutes),
    from,
    to,
    allowed,
    pinnedCrew,
    priority: Float64Array.from(items, (item) => item.priority),
  }
}

/** Places a clock window on the shift's timeline: past midnight when it ends before it starts,
 * or a day later when the whole window falls before the shift begins (night shifts). */
export function windowFor(window: { from: string; to: string }, start: number): [number, number] {
  let lo = parseClock(window.from)
  let hi = parseClock(window.to)
  if (hi < lo) hi += DAY
  if (hi < start) {
    lo += DAY
    hi += DAY
  }
  return [lo, hi]
}
