import type { PlanModel } from './plan-model'
import { runCost } from './plan-schedule'
import type { PlanItem, UnassignedReason } from './plan-types'
import { searchVrptw } from './vrptw/alns'
import type { VrptwModel } from './vrptw/model'

// The engine's budget inside a plan: the iteration budget keeps plans deterministic; the time limit
// only guards a very busy machine and the largest plans. On the demo town 3,000 iterations reach the
// engine's own best of 3 × 30 s where 1,500 stopped 2 % short on every crew's day, in about 1 s
// (npm run bench:plan).
const PLAN_ITERATIONS = 3000
const PLAN_TIME_LIMIT_MS = 5000
const PLAN_SEED = 16
// No route-elimination phase (vrptw/eject.ts): a day usually holds more work than the crews can do,
// so serving every item is out of reach and the phase only spends the budget (measured on the demo
// town by npm run bench:plan: same plans, about half the time).
const PLAN_REDUCE_SHARE = 0

/**
 * The planner's day as a VRPTW for the shared engine (vrptw/): crews are vehicles starting and ending
 * at their own depot within their shift, items are stops with their access window and service
 * minutes, platform needs and pins become which vehicle may take which stop, travel minutes are both
 * time and cost, and an item's weight in the first term of the objective grows with its priority so
 * that one item of a higher priority outweighs every item below it (emergencies are served first).
 * The engine gives a stop one window for every vehicle, while the planner places a window on each
 * crew's own timeline (a night shift puts it on the next day): a crew whose shift the window misses
 * altogether may not take the item, and each crew's timeline is moved by whole days so that the
 * crews that can take an item see its window at the same minutes. Null when no such days exist.
 */
export function planAsVrptw(m: PlanModel): VrptwModel | null {
  const C = m.crewCount
  const n = m.itemCount
  const N = C + n
  const size = n + C
  const allowed = Uint8Array.from(m.allowed, (ok, ci) => {
    const c = Math.floor(ci / n)
    const i = ci % n
    // Outside the shift whatever the travel: closes before the shift starts, or opens too late to finish.
    return ok && m.to[ci] >= m.shiftStart[c] && m.from[ci] + m.service[i] <= m.shiftEnd[c] ? 1 : 0
  })
  const shift = crewDays(m, allowed)
  if (shift === null) return null
  const plan = (e: number) => (e < n ? C + e : e - n)
  const time = new Float64Array(size * size)
  for (let a = 0; a < size; a++)
    for (let b = 0; b < size; b++) time[a * size + b] = m.travel[plan(a) * N + plan(b)]
  const ready = new Float64Array(size)
  const due = new Float64Array(size)
  const service = new Float64Array(size)
  for (let i = 0; i < n; i++) {
    let c = 0
    while (c < C - 1 && !allowed[c * n + i]) c++
    ready[i] = m.from[c * n + i] + shift[c]
    due[i] = m.to[c * n + i] + shift[c]
    service[i] = m.service[i]
  }
  for (let k = 0; k < C; k++) {
    ready[n + k] = m.shiftStart[k] + shift[k]
    due[n + k] = m.shiftEnd[k] + shift[k]
  }
  const levels = [...new Set(m.priority)].sort((a, b) => a - b)
  const weight = Float64Array.from(m.priority, (p) => Math.min((n + 1) ** levels.indexOf(p), 1e15))
  const groupKey = (k: number) => {
    const row: number[] = [due[n + k]]
    for (let e = 0; e < size; e++) row.push(time[e * size + n + k])
    return row.join(',')
  }
  const classKey = (k: number) =>
    `${groupKey(k)}|${ready[n + k]}|${allowed.subarray(k * n, k * n + n).join('')}`
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
    allowed,
    weight,
    endGroup: ids(C, groupKey),
    vehicleClass: ids(C, classKey),
  }
}

const DAY = 24 * 60

/** Minutes (whole days) to add to each crew's timeline so that every item's window reads the same
 * for all the crews that may take it; null when no choice of days does that. */
function crewDays(m: PlanModel, allowed: Uint8Array): Float64Array | null {
  const C = m.crewCount
  const n = m.itemCount
  const shift = new Float64Array(C)
  for (let c = 0; c < C; c++) {
    const fits = (d: number) => {
      for (let e = 0; e < c; e++) {
        for (let i = 0; i < n; i++) {
          if (!allowed[c * n + i] || !allowed[e * n + i]) continue
          if (m.from[c * n + i] + d !== m.from[e * n + i] + shift[e]) return false
          if (m.to[c * n + i] + d !== m.to[e * n + i] + shift[e]) return false
        }
      }
      return true
    }
    const d = [0, -DAY, DAY].find(fits)
    if (d === undefined) return null
    shift[c] = d
  }
  return shift
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
    reduceShare: PLAN_REDUCE_SHARE,
  })
  const blocked = new Set([...reasons.keys()].filter((x) => reasons.get(x) !== 'shift_full'))
  const served = (list: number[][]) => list.flat().reduce((s, x) => s + vm.weight[x], 0)
  const cost = (list: number[][]) => list.reduce((s, seq, c) => s + runCost(m, c, seq), 0)
  const next = solution.routes.map((r) => r.stops())
  if (next.flat().some((x) => blocked.has(x))) return false
  const gain = served(next) - served(seqs)
  if (gain < 0 || (gain === 0 && !(cost(next) < cost(seqs) - 1e-9)) || !Number.isFinite(cost(next)))
    return false
  const before = seqs.flat()
  next.forEach((seq, c) => (seqs[c] = seq))
  const now = new Set(next.flat())
  for (const x of waiting) if (now.has(x)) reasons.delete(x)
  // The engine may leave out an item the planner had placed, to serve heavier ones: say so.
  for (const x of before) if (!now.has(x)) reasons.set(x, 'shift_full')
  return true
}
