import type { VrptwRequest } from './index'

export interface VrptwInputProblem {
  code: 'non_finite_number' | 'duplicate_stop_ids' | 'stop_unreachable'
  message: string
  ids: string[]
}

const FIELDS = ['x', 'y', 'demand', 'ready', 'due', 'service'] as const

/**
 * Stops with a number that is not finite (JSON such as 1e999 reads as Infinity). Reads the raw body
 * before schema validation so the answer can name the stops.
 */
export function nonFiniteStops(body: unknown): VrptwInputProblem | null {
  const stops = (body as { stops?: unknown })?.stops
  if (!Array.isArray(stops)) return null
  const ids: string[] = []
  stops.forEach((s: Record<string, unknown>, i) => {
    if (typeof s !== 'object' || s === null) return
    if (FIELDS.some((f) => typeof s[f] === 'number' && !Number.isFinite(s[f])))
      ids.push(typeof s.id === 'string' ? s.id : `#${i}`)
  })
  return ids.length === 0
    ? null
    : {
        code: 'non_finite_number',
        message: 'Every number must be finite; these stops have one that is not.',
        ids,
      }
}

/** Duplicate ids, then stops that one vehicle cannot serve even as its only stop. */
export function vrptwProblems(req: VrptwRequest): VrptwInputProblem | null {
  const seen = new Set<string>()
  const dup = new Set<string>()
  for (const s of req.stops) {
    if (seen.has(s.id)) dup.add(s.id)
    seen.add(s.id)
  }
  if (dup.size > 0) return { code: 'duplicate_stop_ids', message: 'Stop ids must be unique.', ids: [...dup] }
  const { depot, vehicles } = req
  const unreachable = req.stops
    .filter((s) => {
      const leg = Math.hypot(s.x - depot.x, s.y - depot.y)
      const start = Math.max(depot.ready + leg, s.ready)
      return s.demand > vehicles.capacity || start > s.due || start + s.service + leg > depot.due
    })
    .map((s) => s.id)
  return unreachable.length === 0
    ? null
    : {
        code: 'stop_unreachable',
        message:
          'A vehicle cannot serve these stops even alone: too much demand for one vehicle, or it cannot ' +
          'arrive by their due time, or cannot be back at the depot in time.',
        ids: unreachable,
      }
}
