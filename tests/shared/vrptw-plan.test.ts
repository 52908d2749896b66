// The day planner's view as a VRPTW for the shared engine (shared/routing/plan-vrptw.ts).
import { describe, expect, it } from 'vitest'
import { buildPlanModel } from '../../shared/routing/plan-model'
import { planAsVrptw } from '../../shared/routing/plan-vrptw'
import { planRuns, type PlanInput } from '../../shared/routing/plan'

const crew = (id: string, shiftStart: string, shiftEnd: string, hasPlatform: boolean) => ({
  id,
  name: id,
  depot: { lat: 51.5, lng: -0.1 },
  shiftStart,
  shiftEnd,
  hasPlatform,
})

// Travel minutes over [depot A, depot B, item 1..4]: 10 minutes between any two places.
const matrix = Array.from({ length: 6 }, (_, a) => Array.from({ length: 6 }, (_, b) => (a === b ? 0 : 10)))

const input: PlanInput = {
  crews: [crew('A', '08:00', '16:00', false), crew('B', '09:00', '17:00', true)],
  items: [
    { id: 'i1', lat: 51.5, lng: -0.1, serviceMinutes: 30, priority: 1 },
    {
      id: 'i2',
      lat: 51.5,
      lng: -0.1,
      serviceMinutes: 30,
      priority: 2,
      window: { from: '10:00', to: '11:00' },
    },
    { id: 'i3', lat: 51.5, lng: -0.1, serviceMinutes: 30, priority: 2, needsPlatform: true },
    { id: 'i4', lat: 51.5, lng: -0.1, serviceMinutes: 30, priority: 5, pinnedCrewId: 'A' },
  ],
  settings: { matrixMinutes: matrix },
}

describe('planAsVrptw', () => {
  it('maps crews to vehicles and items to stops', () => {
    const vm = planAsVrptw(buildPlanModel(input))
    expect(vm).not.toBeNull()
    if (!vm) return
    expect([vm.n, vm.v]).toEqual([4, 2])
    // Shifts as depot ready/due in minutes from midnight: 08:00 = 480, 16:00 = 960, 09:00 = 540, 17:00 = 1020.
    expect([vm.ready[4], vm.due[4], vm.ready[5], vm.due[5]]).toEqual([480, 960, 540, 1020])
    // i2's window 10:00–11:00 = 600–660; no window is open-ended.
    expect([vm.ready[1], vm.due[1]]).toEqual([600, 660])
    expect([vm.ready[0], vm.due[0]]).toEqual([-Infinity, Infinity])
    expect(vm.service[0]).toBe(30)
    // Platform need: i3 only on crew B; pin: i4 only on crew A; i1, i2 on both.
    expect(Array.from(vm.allowed ?? [])).toEqual([1, 1, 0, 1, 1, 1, 1, 0])
    // Priority levels 1 < 2 < 5 weigh (n + 1)^rank = 5^0, 5^1, 5^2 = 1, 5, 25 for n = 4 items, so the
    // priority-5 item (25) outweighs all the others together (1 + 5 + 5 = 11).
    expect(Array.from(vm.weight)).toEqual([1, 5, 5, 25])
    // Depots differ in their end time (16:00 vs 17:00): different end groups, so no 2-opt* between them.
    expect(vm.endGroup[0]).not.toBe(vm.endGroup[1])
  })

  it('plans everything on the crews allowed to do it', () => {
    const result = planRuns(input)
    expect(result.unassigned).toEqual([])
    const crewOf = new Map(result.runs.flatMap((r) => r.stops.map((s) => [s.itemId, r.crewId])))
    expect(crewOf.get('i3')).toBe('B')
    expect(crewOf.get('i4')).toBe('A')
  })
})

describe('planAsVrptw across shifts', () => {
  // 10 minutes between any two places over [depot A, depot B, item 1, item 2].
  const m4 = Array.from({ length: 4 }, (_, a) => Array.from({ length: 4 }, (_, b) => (a === b ? 0 : 10)))
  const item = (id: string, from: string, to: string) => ({
    id,
    lat: 51.5,
    lng: -0.1,
    serviceMinutes: 30,
    priority: 1,
    window: { from, to },
  })

  it('keeps an item off a crew whose shift its window misses', () => {
    // A day shift 08:00–16:00 and an evening shift 16:00–00:00; gates open 08:00–15:30 (480–930 min).
    const vm = planAsVrptw(
      buildPlanModel({
        crews: [crew('day', '08:00', '16:00', true), crew('eve', '16:00', '00:00', true)],
        items: [item('gate', '08:00', '15:30'), item('late', '20:00', '22:00')],
        settings: { matrixMinutes: m4 },
      }),
    )
    expect(vm).not.toBeNull()
    if (!vm) return
    // Allowed [crew × item]: day takes the gated item only, the evening crew the 20:00–22:00 one only.
    expect(Array.from(vm.allowed ?? [])).toEqual([1, 0, 0, 1])
    // Windows in minutes from midnight: 08:00–15:30 = 480–930, 20:00–22:00 = 1200–1320.
    expect([vm.ready[0], vm.due[0], vm.ready[1], vm.due[1]]).toEqual([480, 930, 1200, 1320])
  })

  it('moves a night shift back a day so a window both crews can reach reads the same', () => {
    // Night 22:00–06:00 and early 06:00–14:00 (listed first, so its timeline stays); 05:00–07:00 is
    // reachable by both: 300–420 min on the early crew's day, so the night shift runs −120 to 360.
    const vm = planAsVrptw(
      buildPlanModel({
        crews: [crew('early', '06:00', '14:00', true), crew('night', '22:00', '06:00', true)],
        items: [item('dawn', '05:00', '07:00'), item('midnight', '23:00', '01:00')],
        settings: { matrixMinutes: m4 },
      }),
    )
    expect(vm).not.toBeNull()
    if (!vm) return
    expect([vm.ready[2], vm.due[2], vm.ready[3], vm.due[3]]).toEqual([360, 840, -120, 360])
    expect([vm.ready[0], vm.due[0]]).toEqual([300, 420])
    // 23:00–01:00 on the night crew's moved timeline: −60 to 60; the early crew cannot take it.
    expect([vm.ready[1], vm.due[1]]).toEqual([-60, 60])
    expect(Array.from(vm.allowed ?? [])).toEqual([1, 0, 1, 1])
  })
})

describe('planRuns on a day fuller than its crews', () => {
  it('lists every item it does not plan', () => {
    // 40 items of 60 minutes for two 8-hour shifts: at most 16 fit, whatever the order.
    const places = 42
    const matrix = Array.from({ length: places }, (_, a) =>
      Array.from({ length: places }, (_, b) => (a === b ? 0 : 5 + ((a * 7 + b * 13) % 11))),
    )
    const result = planRuns({
      crews: [crew('A', '08:00', '16:00', true), crew('B', '15:00', '23:00', false)],
      items: Array.from({ length: 40 }, (_, i) => ({
        id: `i${i}`,
        lat: 51.5,
        lng: -0.1,
        serviceMinutes: 60,
        priority: (i * 37) % 9,
        ...(i % 5 === 0 ? { window: { from: '08:00', to: '15:30' } } : {}),
        ...(i % 7 === 0 ? { needsPlatform: true } : {}),
      })),
      settings: { matrixMinutes: matrix },
    })
    const planned = result.runs.flatMap((r) => r.stops.map((s) => s.itemId))
    const listed = result.unassigned.map((u) => u.itemId)
    expect(planned.length).toBeLessThanOrEqual(16)
    expect(new Set([...planned, ...listed]).size).toBe(40)
    expect(planned.length + listed.length).toBe(40)
  })
})
