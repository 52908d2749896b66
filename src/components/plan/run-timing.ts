import type { CrewRun } from '../../api/runs'
import { buildPlanModel, formatClock, parseClock, windowFor } from '../../../shared/routing/plan-model'
import { schedule } from '../../../shared/routing/plan-schedule'

const DAY = 24 * 60

export interface TravelSettings {
  speedKmh: number
  detourFactor: number
}

/**
 * Times a run in exactly its current order with the planner's own travel model, so a stop moved by
 * hand shows when the crew would get there. The server times it again on publish.
 */
export function retime(run: CrewRun, settings: TravelSettings): CrewRun {
  const crew = {
    id: String(run.crewId),
    name: run.crewName,
    depot: { lat: run.depot.lat, lng: run.depot.lng },
    shiftStart: run.shiftStart,
    shiftEnd: run.shiftEnd,
    hasPlatform: true,
  }
  const items = run.stops.map((s, i) => ({
    id: String(i),
    lat: s.lat,
    lng: s.lng,
    serviceMinutes: s.serviceMinutes,
    window: s.window ?? undefined,
    priority: 0,
  }))
  const model = buildPlanModel({ crews: [crew], items, settings })
  const { stops, returnAt } = schedule(
    model,
    0,
    items.map((_, i) => i),
  )
  const back = stops.length ? returnAt - stops[stops.length - 1].depart : 0
  return {
    ...run,
    stops: run.stops.map((s, i) => ({
      ...s,
      arrive: formatClock(stops[i].arrive),
      start: formatClock(stops[i].start),
      depart: formatClock(stops[i].depart),
      travelMinutes: stops[i].travel,
    })),
    returnAt: formatClock(returnAt),
    totalTravelMinutes: stops.reduce((sum, s) => sum + s.travel, back),
    totalServiceMinutes: run.stops.reduce((sum, s) => sum + s.serviceMinutes, 0),
  }
}

/** A clock time on the shift's own timeline: a night shift's times after midnight count on. */
function onShift(clock: string, shiftStart: string): number {
  const t = parseClock(clock)
  return t < parseClock(shiftStart) ? t + DAY : t
}

export interface StopNote {
  /** the work cannot start within the site's access window */
  warning: string | null
  /** minutes the crew waits on site for the window to open */
  waitMinutes: number
}

export function stopNotes(run: CrewRun): StopNote[] {
  return run.stops.map((s) => {
    const start = onShift(s.start, run.shiftStart)
    const wait = Math.max(0, start - onShift(s.arrive, run.shiftStart))
    if (!s.window) return { warning: null, waitMinutes: wait }
    // The planner's own placement of the window on the shift timeline, so the sheet and plan agree.
    const [lo, hi] = windowFor(s.window, parseClock(run.shiftStart))
    const outside = start < lo || start > hi
    return {
      warning: outside ? `Starts outside the access window ${s.window.from}–${s.window.to}` : null,
      waitMinutes: wait,
    }
  })
}

/** Minutes the crew would be back after its shift ends (0 when on time). */
export function lateMinutes(run: CrewRun): number {
  if (!run.stops.length) return 0
  const end = parseClock(run.shiftEnd)
  const shiftEnd = end <= parseClock(run.shiftStart) ? end + DAY : end
  return Math.max(0, onShift(run.returnAt, run.shiftStart) - shiftEnd)
}
