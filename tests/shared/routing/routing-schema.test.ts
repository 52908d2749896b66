import { describe, expect, it } from 'vitest'
import { planRequestSchema, tourRequestSchema, type TourRequestInput } from '../../../shared/schemas/routing'
import {
  MAX_PLAN_ITEMS,
  MAX_STOPS_WITH_MATRIX,
  planRequestTooLarge,
  planRuns,
  solveTour,
  tourRequestTooLarge,
  type TourRequest,
} from '../../../shared/routing'

const stops = [
  { id: 'a', lat: 52.63, lng: 1.29 },
  { id: 'b', lat: 52.62, lng: 1.3 },
  { id: 'c', lat: 52.64, lng: 1.31 },
]
const issuePaths = (body: unknown) => {
  const parsed = tourRequestSchema.safeParse(body)
  return parsed.success ? [] : parsed.error.issues.map((issue) => issue.path.join('.'))
}

describe('tourRequestSchema', () => {
  it('accepts coordinates or a square matrix and feeds the solver', () => {
    const parsed = tourRequestSchema.parse({ stops, start: 'b' })
    const request: TourRequest = parsed satisfies TourRequestInput
    expect(solveTour(request).order[0]).toBe('b')
    const matrix = [
      [0, 5, 9],
      [4, 0, 3],
      [8, 2, 0],
    ]
    expect(tourRequestSchema.safeParse({ stops: stops.map(({ id }) => ({ id })), matrix }).success).toBe(true)
  })

  it('rejects a non-square matrix, duplicate ids, an unknown start and mixed coordinates', () => {
    const ids = stops.map(({ id }) => ({ id }))
    expect(
      issuePaths({
        stops: ids,
        matrix: [
          [0, 1, 2],
          [1, 0, 2],
        ],
      }),
    ).toContain('matrix')
    expect(
      issuePaths({
        stops: ids,
        matrix: [
          [0, 1],
          [1, 0],
          [2, 2],
        ],
      }),
    ).toContain('matrix')
    expect(issuePaths({ stops: [...stops, { id: 'a', lat: 0, lng: 0 }] })).toContain('stops.3.id')
    expect(issuePaths({ stops, start: 'z' })).toContain('start')
    expect(
      issuePaths({
        stops: [
          { id: 'a', x: 1, y: 2 },
          { id: 'b', lat: 1, lng: 2 },
        ],
      }),
    ).toContain('stops')
    expect(issuePaths({ stops: [{ id: 'a', lat: 91, lng: 0 }] })).toContain('stops.0.lat')
    expect(
      issuePaths({
        stops: ids,
        matrix: [
          [0, -1, 2],
          [1, 0, 2],
          [1, 1, 0],
        ],
      }),
    ).toContain('matrix.0.1')
  })

  it('leaves the stop limit to tourRequestTooLarge so the server can answer 413', () => {
    const big = Array.from({ length: MAX_STOPS_WITH_MATRIX + 1 }, (_, i) => ({ id: `s${i}`, x: i, y: 0 }))
    expect(tourRequestSchema.safeParse({ stops: big }).success).toBe(true)
    expect(tourRequestTooLarge({ stops: big })).toBe(false)
    expect(tourRequestTooLarge({ stops: big, matrix: [] })).toBe(true)
  })
})

describe('planRequestSchema', () => {
  const crews = [
    {
      id: 'a',
      name: 'Crew A',
      depot: { lat: 52.63, lng: 1.3 },
      shiftStart: '08:00',
      shiftEnd: '16:00',
      hasPlatform: true,
    },
  ]
  const items = [{ id: 'i1', lat: 52.64, lng: 1.31, serviceMinutes: 20, priority: 1 }]

  it('fills the brief’s default speed and detour and feeds planRuns', () => {
    const parsed = planRequestSchema.parse({ crews, items })
    // Defaults from the routing brief (product setting, common practice, no source): 25 km/h, ×1.4.
    expect(parsed.settings).toEqual({ speedKmh: 25, detourFactor: 1.4 })
    expect(planRuns(parsed).runs[0].stops.map((s) => s.itemId)).toEqual(['i1'])
  })

  it('rejects bad clocks, unknown pins, duplicate ids and a non-square matrix', () => {
    const paths = (body: unknown) => {
      const parsed = planRequestSchema.safeParse(body)
      return parsed.success ? [] : parsed.error.issues.map((issue) => issue.path.join('.'))
    }
    expect(paths({ crews: [{ ...crews[0], shiftEnd: '25:00' }], items })).toContain('crews.0.shiftEnd')
    expect(paths({ crews, items: [{ ...items[0], pinnedCrewId: 'zz' }] })).toContain('items.0.pinnedCrewId')
    expect(paths({ crews, items: [{ ...items[0], pinnedIndex: 0 }] })).toContain('items.0.pinnedIndex')
    expect(paths({ crews, items: [items[0], items[0]] })).toContain('items.1.id')
    expect(paths({ crews, items, settings: { matrixMinutes: [[0]] } })).toContain('settings.matrixMinutes')
    expect(
      paths({
        crews,
        items,
        settings: {
          matrixMinutes: [
            [0, 1],
            [1, 0],
          ],
        },
      }),
    ).toEqual([])
  })

  it('leaves size limits to planRequestTooLarge (413)', () => {
    const many = Array.from({ length: MAX_PLAN_ITEMS + 1 }, (_, i) => ({ ...items[0], id: `i${i}` }))
    expect(planRequestTooLarge({ crews, items: many })).toBe(true)
    expect(planRequestTooLarge({ crews, items })).toBe(false)
  })
})
