// The benchmark's independent VRPTW checker (scripts/bench/vrptw-check.ts) and the engine on the same
// hand-made instance, every time and distance worked out by hand below.
import { describe, expect, it } from 'vitest'
import { checkVrptw } from '../../scripts/bench/vrptw-check'
import { solveVrptw } from '../../shared/routing/vrptw/index'

// Depot (0,0) open 0–100; 2 vehicles of capacity 10. Distance = travel time (Euclidean).
//   A (3,4):  demand 3, window 10–18, service 5   depot–A = 5
//   B (6,8):  demand 4, window 0–30,  service 5   depot–B = 10, A–B = 5
//   C (0,-5): demand 5, window 0–50,  service 2   depot–C = 5
// Route [A, B]: leave 0, reach A at 5, wait, start 10, leave 15; reach B at 20 (≤ 30), leave 25;
//   back at 35 (≤ 100); load 7; distance 5 + 5 + 10 = 20.
// Route [C]: reach C at 5 (≤ 50), leave 7, back at 12; load 5; distance 10. Total 30.
// Route [B, A]: start B at 10, leave 15, reach A at 20 > due 18: late.
// Route [A, B, C]: load 12 > 10.
const instance = {
  depot: { x: 0, y: 0, ready: 0, due: 100 },
  vehicles: { count: 2, capacity: 10 },
  stops: [
    { id: 'A', x: 3, y: 4, demand: 3, ready: 10, due: 18, service: 5 },
    { id: 'B', x: 6, y: 8, demand: 4, ready: 0, due: 30, service: 5 },
    { id: 'C', x: 0, y: -5, demand: 5, ready: 0, due: 50, service: 2 },
  ],
}

describe('checkVrptw (independent checker)', () => {
  it('accepts [A, B] + [C] and recomputes its distance 30', () => {
    const report = checkVrptw(instance, { routes: [['A', 'B'], ['C']], unserved: [] })
    expect(report.problems).toEqual([])
    expect(report.ok).toBe(true)
    expect(report.distance).toBeCloseTo(30, 12)
    expect(report.servedCount).toBe(3)
  })

  it('finds a late start: B then A reaches A at 20, due 18', () => {
    const report = checkVrptw(instance, { routes: [['B', 'A'], ['C']], unserved: [] })
    expect(report.ok).toBe(false)
    expect(report.problems).toEqual(['route 0: stop A starts at 20, due 18'])
  })

  it('finds a load over capacity: A + B + C = 12 > 10', () => {
    const report = checkVrptw(instance, { routes: [['A', 'B', 'C']], unserved: [] })
    expect(report.problems).toEqual(['route 0: load 12 over capacity 10'])
  })

  it('finds a late return, a stop visited twice, a stop missing and too many routes', () => {
    const late = checkVrptw(
      { ...instance, depot: { ...instance.depot, due: 30 } },
      {
        routes: [['A', 'B'], ['C']],
        unserved: [],
      },
    )
    // [A, B] is back at 35 (above) > 30.
    expect(late.problems).toEqual(['route 0: back at 35, depot due 30'])
    const twice = checkVrptw(instance, { routes: [['A', 'B'], ['A']], unserved: [] })
    expect(twice.problems).toContain('stop A is visited twice')
    expect(twice.problems).toContain('stop C is neither served nor listed unserved')
    const many = checkVrptw(instance, { routes: [['A'], ['B'], ['C']], unserved: [] })
    expect(many.problems).toEqual(['3 routes, more than the 2 vehicles'])
  })
})

describe('solveVrptw on the hand-made instance', () => {
  it('finds [A, B] + [C] = 30, the optimum', () => {
    // The other ways with 2 vehicles (hand calculation): [A, C] + [B] = 5 + √90 + 5 + 20 ≈ 39.49;
    // [B, C] + [A] = 10 + √205 + 5 + 10 ≈ 39.32; all three on one route is over capacity.
    const result = solveVrptw({ ...instance, timeLimitMs: 1000, maxIterations: 50 })
    expect(result.unserved).toEqual([])
    const routes = [...result.routes].sort((a, b) => b.length - a.length)
    expect(routes).toEqual([['A', 'B'], ['C']])
    expect(result.distance).toBeCloseTo(30, 9)
    expect(checkVrptw(instance, result).ok).toBe(true)
  })

  it('with one vehicle serves the shortest feasible pair, A and C = 10 + √90 ≈ 19.49, and leaves B (no_room)', () => {
    // One route can hold A + B (7), A + C (8) or B + C (9), never all three (12 > 10). Pairs, shortest
    // order: [A, C] or [C, A] = 5 + √90 + 5 ≈ 19.49 (C then A reaches A at 7 + √90 ≈ 16.49 ≤ 18);
    // [A, B] = 20; [B, C] = 10 + √205 + 5 ≈ 29.32. So A and C are served, B is not.
    const result = solveVrptw({ ...instance, vehicles: { count: 1, capacity: 10 }, maxIterations: 50 })
    expect(result.routes).toHaveLength(1)
    expect([...result.routes[0]].sort()).toEqual(['A', 'C'])
    expect(result.distance).toBeCloseTo(10 + Math.sqrt(90), 9)
    expect(result.unserved).toEqual([{ id: 'B', reason: 'no_room' }])
  })
})
