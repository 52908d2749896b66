import type { PlanModel } from './plan-model'
import { runCost } from './plan-schedule'
import type { PlanItem, UnassignedReason } from './plan-types'

export interface Insertion {
  delta: number
  at: number
}

/** Cheapest feasible place for item x in crew c's run (delta Infinity when none). */
export function bestInsertion(
  m: PlanModel,
  c: number,
  seq: readonly number[],
  base: number,
  x: number,
): Insertion {
  let best: Insertion = { delta: Infinity, at: -1 }
  if (!m.allowed[c * m.itemCount + x]) return best
  for (let at = 0; at <= seq.length; at++) {
    const delta = runCost(m, c, seq, -1, x, at) - base
    if (delta < best.delta) best = { delta, at }
  }
  return best
}

/**
 * Why an item cannot be planned on any crew even as its only stop, or null when it can.
 * A window that no shift overlaps (with time to do the work) is `outside_shift`; a window that the
 * crew cannot reach in time from its depot is `window_unreachable`.
 */
export function aloneReason(m: PlanModel, item: PlanItem, x: number): UnassignedReason | null {
  const I = m.itemCount
  let any = false
  let windowInShift = false
  let fitsShift = false
  for (let c = 0; c < m.crewCount; c++) {
    if (!m.allowed[c * I + x]) continue
    any = true
    if (runCost(m, c, [x]) < Infinity) return null
    const latestStart = m.shiftEnd[c] - m.service[x]
    if (Math.max(m.from[c * I + x], m.shiftStart[c]) <= Math.min(m.to[c * I + x], latestStart))
      windowInShift = true
    const N = m.crewCount + I
    const there = m.travel[c * N + m.crewCount + x]
    const back = m.travel[(m.crewCount + x) * N + c]
    if (m.shiftStart[c] + there + m.service[x] + back <= m.shiftEnd[c]) fitsShift = true
  }
  if (!any) return item.needsPlatform ? 'needs_platform' : 'outside_shift'
  if (windowInShift && fitsShift) return 'window_unreachable'
  return 'outside_shift'
}

/**
 * Pinned items go in first, each on its own crew: those with pinnedIndex appended in index order,
 * then the rest at their cheapest place. Returns the items that did not fit.
 */
export function placePinned(
  m: PlanModel,
  items: PlanItem[],
  candidates: number[],
  seqs: number[][],
): number[] {
  const failed: number[] = []
  const indexed = candidates.filter((x) => items[x].pinnedIndex !== undefined)
  indexed.sort((a, b) => (items[a].pinnedIndex as number) - (items[b].pinnedIndex as number) || a - b)
  for (const x of indexed) {
    const c = m.pinnedCrew[x]
    if (runCost(m, c, seqs[c], -1, x, seqs[c].length) < Infinity) seqs[c].push(x)
    else failed.push(x)
  }
  const loose = candidates.filter((x) => items[x].pinnedIndex === undefined)
  loose.sort((a, b) => m.priority[b] - m.priority[a] || a - b)
  for (const x of loose) {
    const c = m.pinnedCrew[x]
    const best = bestInsertion(m, c, seqs[c], runCost(m, c, seqs[c]), x)
    if (best.delta < Infinity) seqs[c].splice(best.at, 0, x)
    else failed.push(x)
  }
  return failed
}

/**
 * Regret insertion (J.-Y. Potvin and J.-M. Rousseau, "A parallel route building algorithm for the
 * vehicle routing and scheduling problem with time windows", EJOR 66, 1993), one priority level at
 * a time from the highest: the item that would lose most by missing its best crew goes first.
 * Returns the items no run could take.
 */
export function insertByRegret(m: PlanModel, candidates: number[], seqs: number[][]): number[] {
  const failed: number[] = []
  const levels = [...new Set(candidates.map((x) => m.priority[x]))].sort((a, b) => b - a)
  for (const level of levels) {
    const open = candidates.filter((x) => m.priority[x] === level)
    const C = m.crewCount
    const cache = new Map<number, Insertion[]>()
    const refresh = (c: number) => {
      const base = runCost(m, c, seqs[c])
      for (const x of open) (cache.get(x) as Insertion[])[c] = bestInsertion(m, c, seqs[c], base, x)
    }
    for (const x of open) cache.set(x, new Array<Insertion>(C))
    for (let c = 0; c < C; c++) refresh(c)
    while (open.length > 0) {
      let pick = -1
      let pickRegret = -Infinity
      let pickBest = Infinity
      for (let k = 0; k < open.length; k++) {
        const options = (cache.get(open[k]) as Insertion[]).map((o) => o.delta).sort((a, b) => a - b)
        const regret = options.length > 1 ? options[1] - options[0] : Infinity
        const better = regret > pickRegret || (regret === pickRegret && options[0] < pickBest)
        if (options[0] < Infinity && better) {
          pick = k
          pickRegret = regret
          pickBest = options[0]
        }
      }
      if (pick < 0) {
        failed.push(...open)
        break
      }
      const x = open[pick]
      const row = cache.get(x) as Insertion[]
      let c = 0
      for (let k = 1; k < C; k++) if (row[k].delta < row[c].delta) c = k
      seqs[c].splice(row[c].at, 0, x)
      open.splice(pick, 1)
      refresh(c)
    }
  }
  return failed
}
