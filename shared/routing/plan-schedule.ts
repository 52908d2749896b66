import type { PlanModel } from './plan-model'

/**
 * Weight of day length in the planner's objective: cost = travel minutes + duration² / 1920 per
 * run. Squaring makes a minute added to a long day dearer (half a travel minute at 8 h, an eighth at
 * 2 h), so work spreads over crews instead of piling onto one while others stay idle.
 */
export const BALANCE_DIVISOR = 1920

/**
 * Objective cost of crew c working `seq` (item indices) with an optional edit: skip position
 * `skip` and put item `insert` at position `at` of the edited sequence. Infinity when a window is
 * missed or the crew is not back by shift end. Arriving early means waiting for the window.
 */
export function runCost(
  m: PlanModel,
  c: number,
  seq: readonly number[],
  skip = -1,
  insert = -1,
  at = -1,
): number {
  const C = m.crewCount
  const I = m.itemCount
  const N = C + I
  const length = seq.length - (skip >= 0 ? 1 : 0) + (insert >= 0 ? 1 : 0)
  if (length === 0) return 0
  let time = m.shiftStart[c]
  let prev = c
  let travel = 0
  let k = 0
  for (let v = 0; v < length; v++) {
    let item: number
    if (v === at && insert >= 0) item = insert
    else {
      if (k === skip) k++
      item = seq[k++]
    }
    const leg = m.travel[prev * N + C + item]
    travel += leg
    let start = time + leg
    const lo = m.from[c * I + item]
    if (start < lo) start = lo
    if (start > m.to[c * I + item]) return Infinity
    time = start + m.service[item]
    prev = C + item
  }
  const back = m.travel[prev * N + c]
  time += back
  if (time > m.shiftEnd[c]) return Infinity
  const duration = time - m.shiftStart[c]
  return travel + back + (duration * duration) / BALANCE_DIVISOR
}

export interface TimedStop {
  item: number
  arrive: number
  start: number
  depart: number
  travel: number
}

/** Clock times of a feasible run, in minutes on the shift's timeline. */
export function schedule(
  m: PlanModel,
  c: number,
  seq: readonly number[],
): { stops: TimedStop[]; returnAt: number } {
  const C = m.crewCount
  const N = C + m.itemCount
  let time = m.shiftStart[c]
  let prev = c
  const stops = seq.map((item) => {
    const travel = m.travel[prev * N + C + item]
    const arrive = time + travel
    const start = Math.max(arrive, m.from[c * m.itemCount + item])
    time = start + m.service[item]
    prev = C + item
    return { item, arrive, start, depart: time, travel }
  })
  const returnAt = seq.length === 0 ? m.shiftStart[c] : time + m.travel[prev * N + c]
  return { stops, returnAt }
}
