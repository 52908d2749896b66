import type { CrewRun, RunStop } from '../../api/runs'

/** A stop by its place on the board: which crew's run, and where in it. */
export interface StopRef {
  crewId: number
  index: number
}

export interface Pin {
  itemId: number
  crewId: number
  index: number
}

function findRun(runs: CrewRun[], crewId: number): CrewRun {
  const run = runs.find((r) => r.crewId === crewId)
  if (!run) throw new RangeError(`no run for crew ${crewId}`)
  return run
}

/**
 * Moves a stop to `to.index` of the target run (counted in the target run as it is before the move)
 * and pins it there, so a re-optimise keeps the supervisor's choice. Returns new run objects.
 */
export function moveStop(runs: CrewRun[], from: StopRef, to: StopRef): CrewRun[] {
  const source = findRun(runs, from.crewId)
  const stop = source.stops[from.index]
  if (!stop) return runs
  let at = to.index
  if (from.crewId === to.crewId && from.index < to.index) at -= 1
  if (from.crewId === to.crewId && at === from.index) return runs
  const moved: RunStop = { ...stop, pinned: true }
  return runs.map((run) => {
    if (run.crewId !== from.crewId && run.crewId !== to.crewId) return run
    const stops = run.crewId === from.crewId ? run.stops.filter((_, i) => i !== from.index) : [...run.stops]
    if (run.crewId === to.crewId) stops.splice(Math.max(0, Math.min(at, stops.length)), 0, moved)
    return { ...run, stops }
  })
}

export function togglePin(runs: CrewRun[], ref: StopRef): CrewRun[] {
  return runs.map((run) =>
    run.crewId !== ref.crewId
      ? run
      : { ...run, stops: run.stops.map((s, i) => (i === ref.index ? { ...s, pinned: !s.pinned } : s)) },
  )
}

/** Pinned stops, each with its position among its own crew's pinned stops (what /runs/plan expects). */
export function pinsOf(runs: CrewRun[]): Pin[] {
  return runs.flatMap((run) =>
    run.stops
      .filter((s): s is RunStop & { itemId: number } => s.pinned && s.itemId !== null)
      .map((s, index) => ({ itemId: s.itemId, crewId: run.crewId, index })),
  )
}

/** Each crew's stops in their current order, for /runs/publish. */
export function publishOrder(runs: CrewRun[]): { crewId: number; itemIds: number[] }[] {
  return runs.map((run) => ({
    crewId: run.crewId,
    itemIds: run.stops.map((s) => s.itemId).filter((id): id is number => id !== null),
  }))
}

/** The stops the supervisor pinned, saved pinned on publish (the others stay free to move). */
export function pinnedItemIds(runs: CrewRun[]): number[] {
  return pinsOf(runs).map((p) => p.itemId)
}

export function itemIdsOf(runs: CrewRun[], unassigned: { itemId: number }[] = []): number[] {
  return [...new Set([...publishOrder(runs).flatMap((r) => r.itemIds), ...unassigned.map((u) => u.itemId)])]
}
