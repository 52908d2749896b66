import { describe, expect, it } from 'vitest'
import { stopNotes } from '../../src/components/plan/run-timing'
import type { CrewRun, RunStop } from '../../src/api/runs'

// A night shift 17:00–01:00; access windows as sites give them (clock times, common practice, no source).
const stop = (start: string, window: RunStop['window']): RunStop => ({
  itemId: 1,
  kind: 'dark',
  summary: 'String dark',
  stringId: 1,
  assetTag: 'WF-HS-001',
  siteName: 'High Street',
  lat: 51.5,
  lng: -0.1,
  arrive: start,
  start,
  depart: start,
  travelMinutes: 5,
  serviceMinutes: 20,
  pinned: false,
  window,
  doneAt: null,
})
const run = (stops: RunStop[]): CrewRun => ({
  id: 1,
  crewId: 1,
  crewName: 'Lantern',
  date: '2026-12-03',
  state: 'draft',
  version: 1,
  publishedAt: null,
  depot: { name: 'Depot', lat: 51.5, lng: -0.1 },
  shiftStart: '17:00',
  shiftEnd: '01:00',
  platform: null,
  stops,
  returnAt: '00:30',
  totalTravelMinutes: 0,
  totalServiceMinutes: 0,
})

describe('access windows on the run sheet', () => {
  it('places a window past midnight on the night shift, as the planner does', () => {
    const [inside, late, early] = stopNotes(
      run([
        stop('00:10', { from: '23:00', to: '02:00' }),
        stop('00:40', { from: '00:00', to: '00:30' }),
        stop('18:00', { from: '00:00', to: '00:30' }),
      ]),
    )
    expect(inside.warning).toBeNull()
    expect(late.warning).toBe('Starts outside the access window 00:00–00:30')
    expect(early.warning).toBe('Starts outside the access window 00:00–00:30')
  })
})
