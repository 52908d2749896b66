import { describe, expect, it } from 'vitest'
import { planarModel, sphereModel } from '../../../shared/routing/cost-model'
import { candidateNeighbours } from '../../../shared/routing/neighbours'

describe('candidate neighbour lists', () => {
  it('keeps a stop in each occupied quadrant when the nearest all lie on one line', () => {
    // Stop 0 at the origin; stops 1–10 at x = 1…10 on the east axis; stop 11 far south at
    // (0, −100); stop 12 north-west at (−50, 50), √5000 ≈ 70.7 away. The 8 nearest are all on the
    // axis, but a tour through the origin may need the south or north-west stop (Johnson and
    // McGeoch 1997, §3.3, quadrant neighbours).
    const points = [[0, 0], ...Array.from({ length: 10 }, (_, i) => [i + 1, 0]), [0, -100], [-50, 50]]
    const model = planarModel(
      Float64Array.from(points, (p) => p[0]),
      Float64Array.from(points, (p) => p[1]),
    )
    const lists = candidateNeighbours(model, 8)
    expect(Array.from(lists.subarray(0, 8))).toEqual([1, 2, 3, 4, 5, 6, 12, 11])
  })

  it('falls back to the nearest stops for a travel matrix', () => {
    // Costs |i − j| on a line: stop 0's nearest are 1, 2, 3 in that order.
    const matrix = Array.from({ length: 6 }, (_, i) => Array.from({ length: 6 }, (_, j) => Math.abs(i - j)))
    const rows = matrix.map((row) => Float64Array.from(row))
    const model = {
      n: 6,
      symmetric: true,
      cost: (i: number, j: number) => rows[i][j],
      near: (i: number, j: number) => rows[i][j],
    }
    expect(Array.from(candidateNeighbours(model, 3).subarray(0, 3))).toEqual([1, 2, 3])
  })

  it('tells compass quadrants on the sphere, across the antimeridian too', () => {
    // From (52° N, 1° E): 0.1° north and east is north-east, and so on round the compass. From
    // (0°, 179.9° E), the point at 0.1° N, 179.9° W lies 0.2° of longitude to the east.
    const lats = Float64Array.from([52, 52.1, 52.1, 51.9, 51.9, 0, 0.1])
    const lngs = Float64Array.from([1, 1.1, 0.9, 0.9, 1.1, 179.9, -179.9])
    const { quadrant } = sphereModel(lats, lngs)
    expect(quadrant).toBeDefined()
    expect([1, 2, 3, 4].map((j) => quadrant?.(0, j))).toEqual([0, 1, 2, 3])
    expect(quadrant?.(5, 6)).toBe(0)
    expect(quadrant?.(6, 5)).toBe(2)
  })
})
