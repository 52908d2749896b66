import { describe, expect, it } from 'vitest'
import { planRuns, type PlanCrew, type PlanItem, type PlanResult } from '../../../shared/routing'
import { greatCircleMetres } from './helpers'

const depot = { lat: 52.63, lng: 1.3 }
const crew = (id: string, extra: Partial<PlanCrew> = {}): PlanCrew => ({
  id,
  name: `Crew ${id}`,
  depot,
  shiftStart: '08:00',
  shiftEnd: '16:00',
  hasPlatform: false,
  ...extra,
})
const item = (id: string, lat: number, lng: number, extra: Partial<PlanItem> = {}): PlanItem => ({
  id,
  lat,
  lng,
  serviceMinutes: 30,
  priority: 1,
  ...extra,
})
// Minutes on a shift's timeline; clock times before the shift start belong to the next day.
const onShift = (hhmm: string, shiftStart = '00:00') => {
  const toMin = (s: string) => Number(s.slice(0, 2)) * 60 + Number(s.slice(3))
  const t = toMin(hhmm)
  return t < toMin(shiftStart) ? t + 1440 : t
}
const run = (plan: PlanResult, crewId: string) => plan.runs.find((r) => r.crewId === crewId)!
const reasonOf = (plan: PlanResult, itemId: string) =>
  plan.unassigned.find((u) => u.itemId === itemId)?.reason
// Two clusters of five street-light strings, about 11 km north and south of the depot.
const north = Array.from({ length: 5 }, (_, i) => item(`n${i}`, 52.73 + i * 0.002, 1.3 + i * 0.003))
const south = Array.from({ length: 5 }, (_, i) => item(`s${i}`, 52.53 - i * 0.002, 1.3 - i * 0.003))

describe('planRuns', () => {
  it('keeps every stop consistent: travel from the default speed and detour, times adding up', () => {
    const plan = planRuns({ crews: [crew('a')], items: north })
    const stops = run(plan, 'a').stops
    expect(stops).toHaveLength(5)
    let prev = { lat: depot.lat, lng: depot.lng }
    let clock = onShift('08:00')
    for (const stop of stops) {
      const here = north.find((i) => i.id === stop.itemId)!
      // Brief defaults (common practice, no source): 25 km/h, detour 1.4; rounded up to whole minutes.
      const expected = Math.ceil(((greatCircleMetres(prev, here) / 1000) * 1.4 * 60) / 25 - 1e-9)
      expect(stop.travelMinutes).toBe(expected)
      expect(onShift(stop.arrive)).toBe(clock + expected)
      expect(onShift(stop.depart) - onShift(stop.start)).toBe(30)
      clock = onShift(stop.depart)
      prev = here
    }
    const serviceTotal = run(plan, 'a').totalServiceMinutes
    expect(serviceTotal).toBe(150)
  })

  it('starts every stop inside its time window, waiting when early', () => {
    const items = [
      item('w1', 52.64, 1.31, { window: { from: '13:00', to: '13:30' } }),
      item('w2', 52.62, 1.29, { window: { from: '09:00', to: '09:15' } }),
      item('w3', 52.65, 1.28, { window: { from: '11:00', to: '12:00' } }),
      ...north.slice(0, 3),
    ]
    const plan = planRuns({ crews: [crew('a'), crew('b')], items })
    expect(plan.unassigned).toEqual([])
    for (const r of plan.runs) {
      for (const stop of r.stops) {
        const window = items.find((i) => i.id === stop.itemId)!.window
        expect(onShift(stop.start)).toBeGreaterThanOrEqual(onShift(stop.arrive))
        if (!window) continue
        expect(onShift(stop.start)).toBeGreaterThanOrEqual(onShift(window.from))
        expect(onShift(stop.start)).toBeLessThanOrEqual(onShift(window.to))
        if (onShift(stop.arrive) < onShift(window.from)) expect(stop.start).toBe(window.from)
      }
    }
  })

  it('returns to the depot by shift end and drops the lowest priority when the day is full', () => {
    const items = Array.from({ length: 12 }, (_, i) =>
      item(`job${i}`, 52.63 + (i % 4) * 0.01, 1.3 + Math.floor(i / 4) * 0.01, {
        serviceMinutes: 60,
        priority: i < 4 ? 3 : i < 8 ? 2 : 1,
      }),
    )
    const plan = planRuns({ crews: [crew('a', { shiftEnd: '14:00' })], items })
    const a = run(plan, 'a')
    expect(onShift(a.returnAt)).toBeLessThanOrEqual(onShift('14:00'))
    expect(a.stops.length).toBeGreaterThanOrEqual(4)
    expect(a.stops.length + plan.unassigned.length).toBe(12)
    const planned = new Set(a.stops.map((s) => s.itemId))
    for (const u of plan.unassigned) {
      expect(u.reason).toBe('shift_full')
      const dropped = items.find((i) => i.id === u.itemId)!
      for (const kept of items.filter((i) => planned.has(i.id)))
        expect(kept.priority).toBeGreaterThanOrEqual(dropped.priority)
    }
  })

  it('keeps pinned items on their crew, in pinnedIndex order', () => {
    const items = [
      ...north,
      item('p2', 52.531, 1.301, { pinnedCrewId: 'b', pinnedIndex: 2 }),
      item('p1', 52.74, 1.31, { pinnedCrewId: 'b', pinnedIndex: 1 }),
      item('p0', 52.6, 1.35, { pinnedCrewId: 'b', pinnedIndex: 0 }),
      item('pn', 52.735, 1.305, { pinnedCrewId: 'b' }),
    ]
    const plan = planRuns({ crews: [crew('a'), crew('b')], items })
    const b = run(plan, 'b').stops.map((s) => s.itemId)
    expect(b).toEqual(expect.arrayContaining(['p0', 'p1', 'p2', 'pn']))
    expect(run(plan, 'a').stops.map((s) => s.itemId)).not.toEqual(expect.arrayContaining(['pn']))
    expect(b.indexOf('p0')).toBeLessThan(b.indexOf('p1'))
    expect(b.indexOf('p1')).toBeLessThan(b.indexOf('p2'))
  })

  it('lists what cannot be planned, with a reason', () => {
    const items = [
      item('lift', 52.64, 1.31, { needsPlatform: true }),
      item('dawn', 52.64, 1.31, { window: { from: '05:00', to: '06:00' } }),
      item('coast', 53.9, 1.3),
      item('tight', 52.73, 1.3, { window: { from: '08:00', to: '08:10' } }),
      ...Array.from({ length: 12 }, (_, i) =>
        item(`busy${i}`, 52.64, 1.31 + i * 0.001, { serviceMinutes: 60 }),
      ),
    ]
    const plan = planRuns({ crews: [crew('a')], items })
    expect(reasonOf(plan, 'lift')).toBe('needs_platform')
    expect(reasonOf(plan, 'dawn')).toBe('outside_shift')
    expect(reasonOf(plan, 'coast')).toBe('outside_shift')
    expect(reasonOf(plan, 'tight')).toBe('window_unreachable')
    expect(plan.unassigned.filter((u) => u.reason === 'shift_full').length).toBeGreaterThan(0)
    for (const u of plan.unassigned) expect(u.message.length).toBeGreaterThan(10)
    const withPlatform = planRuns({ crews: [crew('a'), crew('b', { hasPlatform: true })], items: [items[0]] })
    expect(run(withPlatform, 'b').stops.map((s) => s.itemId)).toEqual(['lift'])
  })

  it('splits spread-out work between two crews and finishes sooner than one crew', () => {
    const items = [...north, ...south]
    const alone = planRuns({ crews: [crew('a', { shiftEnd: '20:00' })], items })
    const pair = planRuns({
      crews: [crew('a', { shiftEnd: '20:00' }), crew('b', { shiftEnd: '20:00' })],
      items,
    })
    expect(alone.unassigned).toEqual([])
    expect(pair.unassigned).toEqual([])
    const finish = (plan: PlanResult) => Math.max(...plan.runs.map((r) => onShift(r.returnAt)))
    expect(finish(pair)).toBeLessThan(finish(alone))
    for (const r of pair.runs) {
      const sides = new Set(r.stops.map((s) => s.itemId[0]))
      expect(sides.size).toBe(1)
    }
  })

  it('uses a supplied travel matrix, which may be asymmetric', () => {
    // Nodes: depot of crew a, then items x and y. Uphill depot→x is slow, x→depot quick.
    const matrixMinutes = [
      [0, 40, 10],
      [5, 0, 10],
      [10, 10, 0],
    ]
    const plan = planRuns({
      crews: [crew('a')],
      items: [item('x', 52.7, 1.3), item('y', 52.6, 1.3)],
      settings: { matrixMinutes },
    })
    const a = run(plan, 'a')
    // depot→y→x→depot = 10 + 10 + 5 = 25 beats depot→x→y→depot = 40 + 10 + 10 = 60.
    expect(a.stops.map((s) => [s.itemId, s.travelMinutes])).toEqual([
      ['y', 10],
      ['x', 10],
    ])
    expect(a.totalTravelMinutes).toBe(25)
  })

  it('plans a night shift across midnight and is deterministic', () => {
    const night = crew('n', { shiftStart: '18:00', shiftEnd: '02:00' })
    const items = [
      item('late', 52.64, 1.31, { window: { from: '23:30', to: '00:30' } }),
      item('dusk', 52.65, 1.32, { window: { from: '18:30', to: '19:00' } }),
      ...south.slice(0, 2),
    ]
    const plan = planRuns({ crews: [night], items })
    expect(plan.unassigned).toEqual([])
    const stops = run(plan, 'n').stops
    const late = stops.find((s) => s.itemId === 'late')!
    expect(onShift(late.start, '18:00')).toBeGreaterThanOrEqual(onShift('23:30', '18:00'))
    expect(onShift(late.start, '18:00')).toBeLessThanOrEqual(onShift('00:30', '18:00'))
    expect(onShift(run(plan, 'n').returnAt, '18:00')).toBeLessThanOrEqual(onShift('02:00', '18:00'))
    expect(planRuns({ crews: [night], items })).toEqual(plan)
  })
})
