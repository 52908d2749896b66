// Where a stop on a published run stands after the crew's visits: the one rule the crew's run, the
// run sheet and the supervisor's board read. The server works it out from the visits logged on the
// stop's string since the run was published (run-list.ts); nothing here reads a database.
import type { StopProgress } from './schemas/runs'
import type { StringStatus } from './vocab/string-states'

export const stopStates = ['todo', 'done', 'open', 'new_fault'] as const
export type StopState = (typeof stopStates)[number]

/** The crew's words for each state, on the run, the sheet and the board alike. */
export const stopStateLabel: Record<StopState, string> = {
  todo: 'To do',
  done: 'Done',
  open: 'Still open',
  new_fault: 'New fault found',
}

/** One visit as the rule reads it (in the order logged). */
export interface StopVisit {
  at: string
  statusAfter: StringStatus
  lampsOutAfter: number
  failedFound: number
  darkOnArrival: boolean
}

export interface StopFacts {
  /** The stop's queue item kind (null: a stop without an item). */
  kind: string | null
  /** Set when the stop was closed without a visit (an emergency log made it safe). */
  doneAt: string | null
  /** The stop's item was closed or merged (by a visit, a log or the office). */
  itemClosed: boolean
  /** Visits logged on the stop's string since the run was published, oldest first. */
  visits: StopVisit[]
}

/** States a visit can leave a string in that need no more work tonight (its items close: string-items.ts). */
const SETTLED: readonly StringStatus[] = ['lit', 'watch', 'safe']

/**
 * Done: the last visit left the string lit, on watch or made safe, or the stop's item was closed
 * without one. Still open: visited, but the string still needs replacing or is dark. New fault found:
 * visited, still needing work, and a visit found lamps failed (or the string dark) beyond the ticket.
 */
export function stopState(f: StopFacts): StopProgress {
  const last = f.visits[f.visits.length - 1]
  // An emergency log closes its stop: what was found and done is on the log, not a visit.
  if (f.doneAt && (!last || last.at <= f.doneAt))
    return { state: 'done', at: f.doneAt, statusAfter: null, lampsOutAfter: null, visits: f.visits.length }
  if (!last) {
    const state = f.itemClosed ? 'done' : 'todo'
    return { state, at: null, statusAfter: null, lampsOutAfter: null, visits: 0 }
  }
  const seen = {
    at: last.at,
    statusAfter: last.statusAfter,
    lampsOutAfter: last.lampsOutAfter,
    visits: f.visits.length,
  }
  if (SETTLED.includes(last.statusAfter)) return { state: 'done', ...seen }
  const found = f.visits.some((v) => v.failedFound > 0 || (v.darkOnArrival && f.kind !== 'dark'))
  return { state: found ? 'new_fault' : 'open', ...seen }
}

/** Stops finished and stops left, for the run's header. */
export function runCounts(progress: readonly (StopProgress | undefined)[]): { done: number; left: number } {
  const done = progress.filter((p) => p?.state === 'done').length
  return { done, left: progress.length - done }
}
