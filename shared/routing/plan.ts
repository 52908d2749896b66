import { MAX_PLAN_CREWS, MAX_PLAN_ITEMS } from './limits'
import { aloneReason, bestInsertion, insertByRegret, placePinned } from './plan-build'
import { improveRuns } from './plan-improve'
import { buildPlanModel, formatClock, type PlanModel } from './plan-model'
import { runCost, schedule } from './plan-schedule'
import { improveWithEngine } from './plan-vrptw'
import type { CrewRun, PlanInput, PlanItem, PlanResult, UnassignedItem, UnassignedReason } from './plan-types'

export type * from './plan-types'
export { DEFAULT_DETOUR_FACTOR, DEFAULT_SPEED_KMH } from './plan-model'

const MESSAGES: Record<UnassignedReason, string> = {
  needs_platform: 'Needs a platform vehicle and no suitable crew has one.',
  outside_shift: 'Cannot be done within any suitable crew’s shift, travel to and from the depot included.',
  window_unreachable: 'No suitable crew can start it within its time window and still be back by shift end.',
  shift_full: 'Every suitable crew’s day is already full with work of the same or higher priority.',
}

/**
 * Plans one day for several crews: which crew does which item, in what order and at what times.
 * Pure and deterministic. Items nobody can do are listed with a reason instead of being planned.
 * Throws RangeError for duplicate ids, pins to unknown crews or sizes over the limits.
 */
export function planRuns(input: PlanInput): PlanResult {
  const { crews, items } = input
  if (crews.length > MAX_PLAN_CREWS || items.length > MAX_PLAN_ITEMS) {
    throw new RangeError(`at most ${MAX_PLAN_CREWS} crews and ${MAX_PLAN_ITEMS} items per plan`)
  }
  if (new Set(crews.map((c) => c.id)).size !== crews.length) throw new RangeError('crew ids must be unique')
  if (new Set(items.map((i) => i.id)).size !== items.length) throw new RangeError('item ids must be unique')
  const m = buildPlanModel(input)
  const reasons = new Map<number, UnassignedReason>()
  const pinned: number[] = []
  const loose: number[] = []
  items.forEach((item, x) => {
    const reason = aloneReason(m, item, x)
    if (reason) reasons.set(x, reason)
    else if (m.pinnedCrew[x] >= 0) pinned.push(x)
    else loose.push(x)
  })
  const seqs: number[][] = crews.map(() => [])
  for (const x of placePinned(m, items, pinned, seqs)) reasons.set(x, 'shift_full')
  for (const x of insertByRegret(m, loose, seqs)) reasons.set(x, 'shift_full')
  improveRuns(m, seqs)
  // Improvement can free room: offer it to the items that did not fit, highest priority first.
  for (let round = 0; round < 3 && retryFull(m, reasons, seqs); round++) improveRuns(m, seqs)
  // The VRPTW engine (vrptw/) searches further; its answer is kept only when the planner gains by it.
  if (improveWithEngine(m, items, seqs, reasons)) improveRuns(m, seqs)
  return {
    runs: crews.map((crew, c) => toRun(m, items, crew.id, c, seqs[c])),
    unassigned: unassigned(items, reasons),
  }
}

function retryFull(m: PlanModel, reasons: Map<number, UnassignedReason>, seqs: number[][]): boolean {
  const waiting = [...reasons].filter(([, r]) => r === 'shift_full').map(([x]) => x)
  waiting.sort((a, b) => m.priority[b] - m.priority[a] || a - b)
  let placed = false
  for (const x of waiting) {
    let bestCrew = -1
    let best = { delta: Infinity, at: -1 }
    for (let c = 0; c < m.crewCount; c++) {
      const option = bestInsertion(m, c, seqs[c], runCost(m, c, seqs[c]), x)
      if (option.delta < best.delta) {
        best = option
        bestCrew = c
      }
    }
    if (bestCrew < 0) continue
    seqs[bestCrew].splice(best.at, 0, x)
    reasons.delete(x)
    placed = true
  }
  return placed
}

function toRun(m: PlanModel, items: PlanItem[], crewId: string, c: number, seq: number[]): CrewRun {
  const { stops, returnAt } = schedule(m, c, seq)
  const back = seq.length === 0 ? 0 : returnAt - stops[stops.length - 1].depart
  return {
    crewId,
    stops: stops.map((s) => ({
      itemId: items[s.item].id,
      arrive: formatClock(s.arrive),
      start: formatClock(s.start),
      depart: formatClock(s.depart),
      travelMinutes: s.travel,
    })),
    returnAt: formatClock(returnAt),
    totalTravelMinutes: stops.reduce((sum, s) => sum + s.travel, back),
    totalServiceMinutes: stops.reduce((sum, s) => sum + m.service[s.item], 0),
  }
}

function unassigned(items: PlanItem[], reasons: Map<number, UnassignedReason>): UnassignedItem[] {
  return [...reasons.keys()]
    .sort((a, b) => a - b)
    .map((x) => {
      const reason = reasons.get(x) as UnassignedReason
      const w = items[x].window
      // A full day is usually a full access window: say which window, so the planner knows what to change.
      const message =
        reason === 'shift_full' && w
          ? `Every suitable crew is already busy during its access window (${w.from}–${w.to}) with work of the same or higher priority.`
          : MESSAGES[reason]
      return { itemId: items[x].id, reason, message }
    })
}
