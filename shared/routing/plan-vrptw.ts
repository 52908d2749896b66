import type { PlanModel } from './plan-model'
import { runCost } from './plan-schedule'
import type { PlanItem, UnassignedReason } from './plan-types'
import { searchVrptw } from './vrptw/alns'
import type { VrptwModel } from './vrptw/model'

// The engine's budget inside a plan: the iteration budget keeps plans deterministic; the time limit
// only guards a very busy machine (a day's plan for a few crews takes well under a second).
const PLAN_ITERATIONS = 1500
const PLAN_TIME_LIMIT_MS = 5000
const PLAN_SEED = 16

/**
 * The planner's day as a VRPTW for the shared engine (vrptw/): crews are vehicles starting and ending
 * at their own depot within their shift, items are stops with their access window and service
 * minutes, platform needs and pins become which vehicle may take which stop, travel minutes are both
 * time and cost, and an item's weight in the first term of the objective grows with its priority so
 * that one item of a higher priority outweighs every item below it (emergencies are served first).
 * Null when the access windows differ between crews (night shifts place them on different days).
 */
export function planAsVrptw(m: PlanModel): VrptwModel | null {
  const C = m.crewCount
  const n = m.itemCount
  const N = C + n
  const size = n + C
  for (let i = 0; i < n; i++) {
    for (let c = 1; c < C; c++)
      if (m.from[c * n + i] !== m.from[i] || m.to[c * n + i] !== m.to[i]) return null
  }
  const plan = (e: number) => (e < n ? C + e : e - n)
  const time = new Float64Array(size * size)
  for (let a = 0; a < size; a++)
    for (let b = 0; b < size; b++) time[a * size + b] = m.travel[plan(a) * N + plan(b)]
  const ready = new Float64Array(size)
  const due = new Float64Array(size)
  const service = new Float64Array(size)
  for (let i = 0; i < n; i++) {
    ready[i] = m.from[i]
    due[i] = m.to[i]
    service[i] = m.service[i]
  }
  for (let k = 0; k < C; k++) {
    ready[n + k] = m.shiftStart[k]
    due[n + k] = m.shiftEnd[k]
  }
  const levels = [...new Set(m.priority)].sort((a, b) => a - b)
  const weight = Float64Array.from(m.priority, (p) => Math.min((n + 1) ** levels.indexOf(p), 1e15))
  const groupKey = (k: number) => {
    const row: number[] = [m.shiftEnd[k]]
    for (let e = 0; e < size; e++) row.push(time[e * size + n + k])
    return row.join(',')
  }
  const classKey = (k: number) =>
    `${groupKey(k)}|${m.shiftStart[k]}|${m.allowed.subarray(k * n, k * n + n).join('')}`
  return {
    n,
    v: C,
    size,
    dist: time,
    time,
    ready,
    due,
    service,
    demand: new Float64Array(size),
    capacity: new Float64Array(C).fill(Infinity),
    allowed: m.allowed,
    weight,
    endGroup: ids(C, groupKey),
    vehicleClass: ids(C, classKey),
  }
}

function ids(count: number, key: (k: number) => string): Int32Array {
  const seen = new Map<string, number>()
  return Int32Array.from({ length: count }, (_, k) => {
    const s = key(k)
    if (!seen.has(s)) seen.set(s, seen.size)
    return seen.get(s) as number
  })
}

/**
 * Runs the engine from the planner's runs and keeps its answer when it serves more priority weight,
 * or the same with a lower planner cost (travel plus the day-length balance term). Items the engine
 * leaves out keep the reason `shift_full`. Skipped when pinned items carry an order (the engine
 * does not keep pinnedIndex order). Returns true when the runs changed.
 */
export function improveWithEngine(
  m: PlanModel,
  items: readonly PlanItem[],
  seqs: number[][],
  reasons: Map<number, UnassignedReason>,
): boolean {
  if (items.some((item) => item.pinnedIndex !== undefined)) return false
  const vm = planAsVrptw(m)
  if (vm === null) return false
  const waiting = [...reasons].filter(([, r]) => r === 'shift_full').map(([x]) => x)
  const { solution } = searchVrptw(vm, {
    seed: PLAN_SEED,
    timeLimitMs: PLAN_TIME_LIMIT_MS,
    maxIterations: PLAN_ITERATIONS,
    initial: seqs,
  })
  const blocked = new Set([...reasons.keys()].filter((x) => reasons.get(x) !== 'shift_full'))
  const served = (list: number[][]) => list.flat().reduce((s, x) => s + vm.weight[x], 0)
  const cost = (list: number[][]) => list.reduce((s, seq, c) => s + runCost(m, c, seq), 0)
  const next = solution.routes.map((r) => r.stops())
  if (next.flat().some((x) => blocked.has(x))) return false
  const gain = served(next) - served(seqs)
  if (gain < 0 || (gain === 0 && !(cost(next) < cost(seqs) - 1e-9)) || !Number.isFinite(cost(next)))
    return false
  next.forEach((seq, c) => (seqs[c] = seq))
  const now = new Set(next.flat())
  for (const x of waiting) if (now.has(x)) reasons.delete(x)
  return true
}
