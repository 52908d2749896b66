import { describe, expect, it } from 'vitest'
import { solveTour } from '../../../shared/routing'
import { readTsplib, TSPLIB_OPTIMA, tsplibTourLength } from '../../fixtures/tsplib/tsplib'

// TSPLIB EUC_2D rounding nint(sqrt(dx² + dy²)) (Reinelt 1991), used during the search as well.
const nint = (d: number) => Math.floor(d + 0.5)

describe('solveTour on TSPLIB instances', () => {
  // Optima from the TSPLIB95 solutions list (Reinelt 1991): eil51 426, berlin52 7542.
  for (const name of ['eil51', 'berlin52']) {
    it(`${name} comes within 3 % of the published optimum`, () => {
      const instance = readTsplib(name)
      const result = solveTour({ stops: instance.nodes, timeLimitMs: 500 }, { roundDistance: nint })
      expect(new Set(result.order).size).toBe(instance.nodes.length)
      const length = tsplibTourLength(instance, result.order)
      expect(length).toBe(result.cost)
      expect(length).toBeGreaterThanOrEqual(TSPLIB_OPTIMA[name])
      expect(length).toBeLessThanOrEqual(TSPLIB_OPTIMA[name] * 1.03)
    })
  }

  it('parses the fixture files', () => {
    // eil51.tsp and rl1304.tsp (TSPLIB95): node 1 of eil51 is at (37, 52); rl1304 has 1304 nodes,
    // its last at (1.11200e+04, 4.70800e+03).
    expect(readTsplib('eil51').nodes[0]).toEqual({ id: '1', x: 37, y: 52 })
    const rl = readTsplib('rl1304').nodes
    expect(rl).toHaveLength(1304)
    expect(rl[1303]).toEqual({ id: '1304', x: 11120, y: 4708 })
  })
})
