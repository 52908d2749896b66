import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { MAX_STOPS_WITH_COORDINATES, MAX_STOPS_WITH_MATRIX, solveTour } from '../../../shared/routing'
import { bruteForceOptimum, closedTourCost, greatCircleMetres, lcg } from './helpers'

// Eight points chosen by hand; the optimum comes from enumerating all 7! tours below.
const eight = [
  [0, 0],
  [4, 1],
  [7, 5],
  [3, 8],
  [-2, 6],
  [1, 3],
  [6, -2],
  [-3, 1],
].map(([x, y], i) => ({ id: `p${i}`, x, y }))
const euclid = (i: number, j: number) => Math.hypot(eight[i].x - eight[j].x, eight[i].y - eight[j].y)

// Asymmetric 8×8 travel matrix (one-way streets, uphill legs): arbitrary integers, zero diagonal.
const oneWay = Array.from({ length: 8 }, (_, i) =>
  Array.from({ length: 8 }, (_, j) => (i === j ? 0 : ((i * 7 + j * 13 + i * j * 5) % 23) + 2)),
)

const indexOf = (order: string[]) => order.map((id) => Number(id.slice(1)))

describe('solveTour on tiny instances', () => {
  const optimum = bruteForceOptimum(8, euclid)

  it('finds the enumerated optimum (exact path and heuristic path)', () => {
    for (const exactMaxStops of [undefined, 0]) {
      const result = solveTour({ stops: eight }, { exactMaxStops })
      expect(result.cost).toBeCloseTo(optimum, 9)
      expect(closedTourCost(indexOf(result.order), euclid)).toBeCloseTo(optimum, 9)
    }
  })

  it('handles an asymmetric matrix: the optimum is over directed costs', () => {
    const cost = (i: number, j: number) => oneWay[i][j]
    const optimumDirected = bruteForceOptimum(8, cost)
    const stops = eight.map(({ id }) => ({ id }))
    for (const exactMaxStops of [undefined, 0]) {
      const result = solveTour({ stops, matrix: oneWay }, { exactMaxStops })
      expect(result.cost).toBe(optimumDirected)
      expect(closedTourCost(indexOf(result.order), cost)).toBe(optimumDirected)
    }
  })

  it('handles 0, 1 and 2 stops', () => {
    expect(solveTour({ stops: [] })).toEqual({ order: [], cost: 0 })
    expect(solveTour({ stops: [{ id: 'a', x: 1, y: 1 }] })).toEqual({ order: ['a'], cost: 0 })
    const two = solveTour({
      stops: [
        { id: 'a', x: 0, y: 0 },
        { id: 'b', x: 3, y: 4 },
      ],
      start: 'b',
    })
    expect(two).toEqual({ order: ['b', 'a'], cost: 10 })
  })
})

describe('solveTour on larger instances', () => {
  it('follows a hidden one-way ring through 60 stops that reversing would ruin', () => {
    const random = lcg(11)
    const ring = Array.from({ length: 60 }, (_, i) => i)
    for (let i = ring.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1))
      ;[ring[i], ring[j]] = [ring[j], ring[i]]
    }
    const next = new Map(ring.map((stop, k) => [stop, ring[(k + 1) % ring.length]]))
    const matrix = ring.map((_, i) => ring.map((_, j) => (i === j ? 0 : next.get(i) === j ? 1 : 20)))
    const stops = ring.map((_, i) => ({ id: `s${i}` }))
    const result = solveTour({ stops, matrix, start: 's5' })
    expect(result.cost).toBe(60)
    const order = indexOf(result.order)
    order.forEach((stop, k) => expect(next.get(stop)).toBe(order[(k + 1) % order.length]))
  })

  it('visits every stop once, honours start and reports the cost of the tour it returns', () => {
    const point = fc.record({
      x: fc.integer({ min: -500, max: 500 }),
      y: fc.integer({ min: -500, max: 500 }),
    })
    fc.assert(
      fc.property(fc.array(point, { minLength: 1, maxLength: 40 }), fc.nat(), (points, pick) => {
        const stops = points.map((p, i) => ({ id: `s${i}`, ...p }))
        const start = stops[pick % stops.length].id
        const result = solveTour({ stops, start, timeLimitMs: 200 })
        expect(result.order[0]).toBe(start)
        expect([...result.order].sort()).toEqual(stops.map((s) => s.id).sort())
        const dist = (i: number, j: number) =>
          Math.hypot(points[i].x - points[j].x, points[i].y - points[j].y)
        expect(result.cost).toBeCloseTo(closedTourCost(indexOf(result.order), dist), 6)
      }),
      { numRuns: 40 },
    )
  })

  it('measures lat/lng tours in great-circle metres', () => {
    // Four points round the equator: the tour is the whole great circle, 2πR with the IUGG mean
    // radius R1 = 6371008.8 m (Moritz, GRS80) ≈ 40 030 174 m.
    const equator = [0, 90, 180, -90].map((lng, i) => ({ id: `e${i}`, lat: 0, lng }))
    expect(solveTour({ stops: equator }).cost).toBeCloseTo(2 * Math.PI * 6371008.8, 3)

    const random = lcg(5)
    const town = Array.from({ length: 30 }, (_, i) => ({
      id: `t${i}`,
      lat: 52.6 + random() / 20,
      lng: 1.28 + random() / 12,
    }))
    const result = solveTour({ stops: town, start: 't7' })
    const dist = (i: number, j: number) => greatCircleMetres(town[i], town[j])
    expect(result.cost).toBeCloseTo(closedTourCost(indexOf(result.order), dist), 6)
  })

  it('gives the same answer for the same input', () => {
    const random = lcg(99)
    const stops = Array.from({ length: 80 }, (_, i) => ({
      id: `s${i}`,
      x: random() * 1000,
      y: random() * 1000,
    }))
    expect(solveTour({ stops })).toEqual(solveTour({ stops }))
  })
})

describe('solveTour refuses bad requests', () => {
  const many = (count: number) => Array.from({ length: count }, (_, i) => ({ id: `s${i}`, x: i, y: 0 }))

  it('rejects duplicate ids, an unknown start, a non-square matrix and missing coordinates', () => {
    expect(() =>
      solveTour({
        stops: [
          { id: 'a', x: 0, y: 0 },
          { id: 'a', x: 1, y: 1 },
        ],
      }),
    ).toThrow(RangeError)
    expect(() => solveTour({ stops: many(3), start: 'nope' })).toThrow(RangeError)
    expect(() =>
      solveTour({
        stops: many(3),
        matrix: [
          [0, 1, 2],
          [1, 0, 2],
        ],
      }),
    ).toThrow(/square/)
    expect(() =>
      solveTour({
        stops: [
          { id: 'a', x: 0, y: 0 },
          { id: 'b', lat: 1, lng: 1 },
        ],
      }),
    ).toThrow(RangeError)
  })

  it('enforces the published stop limits', () => {
    expect(MAX_STOPS_WITH_MATRIX).toBe(1000)
    expect(MAX_STOPS_WITH_COORDINATES).toBe(5000)
    expect(() => solveTour({ stops: many(MAX_STOPS_WITH_MATRIX + 1), matrix: [] })).toThrow(/at most/)
    expect(() => solveTour({ stops: many(MAX_STOPS_WITH_COORDINATES + 1) })).toThrow(/at most/)
  })
})
