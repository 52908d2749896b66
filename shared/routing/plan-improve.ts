import type { PlanModel } from './plan-model'
import { runCost } from './plan-schedule'

const MIN_GAIN = 1e-9
// Each pass is cheap for a day's work (hundreds of items); the cap keeps the worst case bounded.
const MAX_PASSES = 40

/**
 * First-improvement local search over the runs with moves that keep every run feasible (M. W. P.
 * Savelsbergh, "The Vehicle Routing Problem with Time Windows: Minimizing Route Duration", ORSA J.
 * Computing 4(2), 1992): relocate one stop (within or between runs), exchange two stops between
 * runs, and Or-opt (move a run of two or three stops within its run). Pinned items never move, so
 * they stay on their crew and keep their order. Deterministic: fixed scan order, no randomness.
 */
export function improveRuns(m: PlanModel, seqs: number[][]): void {
  const costs = seqs.map((seq, c) => runCost(m, c, seq))
  for (let pass = 0; pass < MAX_PASSES; pass++) {
    const moved = relocate(m, seqs, costs) || exchange(m, seqs, costs) || orOpt(m, seqs, costs)
    if (!moved) return
  }
}

const movable = (m: PlanModel, x: number) => m.pinnedCrew[x] < 0
const allowed = (m: PlanModel, c: number, x: number) => m.allowed[c * m.itemCount + x] === 1

function relocate(m: PlanModel, seqs: number[][], costs: number[]): boolean {
  let moved = false
  for (let a = 0; a < seqs.length; a++) {
    for (let r = 0; r < seqs[a].length; r++) {
      const x = seqs[a][r]
      if (!movable(m, x)) continue
      const without = runCost(m, a, seqs[a], r)
      for (let b = 0; b < seqs.length; b++) {
        if (!allowed(m, b, x)) continue
        const slots = b === a ? seqs[a].length : seqs[b].length + 1
        for (let at = 0; at < slots; at++) {
          if (b === a && at === r) continue
          const after =
            b === a ? runCost(m, a, seqs[a], r, x, at) : without + runCost(m, b, seqs[b], -1, x, at)
          const before = b === a ? costs[a] : costs[a] + costs[b]
          if (after < before - MIN_GAIN) {
            seqs[a].splice(r, 1)
            seqs[b].splice(at, 0, x)
            costs[a] = runCost(m, a, seqs[a])
            costs[b] = runCost(m, b, seqs[b])
            moved = true
            break
          }
        }
        if (seqs[a][r] !== x) break
      }
    }
  }
  return moved
}

function exchange(m: PlanModel, seqs: number[][], costs: number[]): boolean {
  let moved = false
  for (let a = 0; a < seqs.length; a++) {
    for (let b = a + 1; b < seqs.length; b++) {
      for (let r = 0; r < seqs[a].length; r++) {
        const x = seqs[a][r]
        if (!movable(m, x) || !allowed(m, b, x)) continue
        for (let q = 0; q < seqs[b].length; q++) {
          const y = seqs[b][q]
          if (!movable(m, y) || !allowed(m, a, y)) continue
          const after = runCost(m, a, seqs[a], r, y, r) + runCost(m, b, seqs[b], q, x, q)
          if (after < costs[a] + costs[b] - MIN_GAIN) {
            seqs[a][r] = y
            seqs[b][q] = x
            costs[a] = runCost(m, a, seqs[a])
            costs[b] = runCost(m, b, seqs[b])
            moved = true
            break
          }
        }
      }
    }
  }
  return moved
}

function orOpt(m: PlanModel, seqs: number[][], costs: number[]): boolean {
  let moved = false
  for (let c = 0; c < seqs.length; c++) {
    for (let len = 2; len <= 3; len++) {
      for (let r = 0; r + len <= seqs[c].length; r++) {
        const seq = seqs[c]
        const segment = seq.slice(r, r + len)
        if (!segment.every((x) => movable(m, x))) continue
        const rest = [...seq.slice(0, r), ...seq.slice(r + len)]
        for (let at = 0; at <= rest.length; at++) {
          if (at === r) continue
          const candidate = [...rest.slice(0, at), ...segment, ...rest.slice(at)]
          const cost = runCost(m, c, candidate)
          if (cost < costs[c] - MIN_GAIN) {
            seqs[c] = candidate
            costs[c] = cost
            moved = true
            break
          }
        }
      }
    }
  }
  return moved
}
