import { createRandom, randomInt } from '../prng'
import { randomRemoval, routeRemoval, shawRemoval, worstRemoval, type Destroy } from './destroy'
import { emptyPool } from './eject'
import { localSearch } from './local-search'
import { servableAlone, type VrptwModel } from './model'
import { repair } from './repair'
import { better, Solution } from './solution'

export interface SearchOptions {
  seed?: number
  /** wall-clock budget of the improvement phase */
  timeLimitMs: number
  /** iteration budget; when given, the cooling follows iterations and the answer depends only on the seed */
  maxIterations?: number
  /** a feasible start: stops per vehicle, in order (the rest are inserted by regret) */
  initial?: readonly (readonly number[])[]
  /** share of the budget for serving every stop with the vehicles given (eject.ts); 0 skips it */
  reduceShare?: number
  /** current time in ms (tests and benches may pass a fake clock) */
  now?: () => number
}

export interface SearchResult {
  solution: Solution
  /** stops no vehicle can serve even alone */
  unreachable: number[]
  iterations: number
}

const DESTROYS: Destroy[] = [randomRemoval, worstRemoval, shawRemoval, routeRemoval]
// Repairs: [regret k, noise on]; k = 1 is greedy (Ropke and Pisinger 2006 use regret-2..4 and -m).
const REPAIRS: [number, boolean][] = [
  [1, false],
  [2, false],
  [3, false],
  [2, true],
]
// Scores for a new best, a better-than-current and an accepted worse solution; reaction factor.
const SIGMA = [33, 9, 13]
const REACTION = 0.1
const SEGMENT = 100
// Start temperature: a solution this much worse than the first is accepted with probability 1/2.
const START_WORSE = 0.02
const END_RATIO = 0.002
// At most this share of the time goes to serving every stop with the vehicles given (eject.ts).
const REDUCE_SHARE = 0.5

/**
 * Adaptive large neighbourhood search for the VRPTW (S. Ropke and D. Pisinger, "An adaptive large
 * neighborhood search heuristic for the pickup and delivery problem with time windows",
 * Transportation Science 40(4), 2006; applied to the VRPTW in Pisinger and Ropke, Computers & OR
 * 34, 2007): regret insertion builds a first solution; each iteration removes q stops (random,
 * worst, related or a whole route) and reinserts them (greedy or regret, optionally with noise),
 * with operators chosen by adaptively weighted roulette and simulated-annealing acceptance.
 * Unserved stops stay in a request bank that every repair tries again, so with a fixed vehicle
 * count the search first drives the unserved count down, then the distance. Promising solutions
 * are polished with local search (local-search.ts). Anytime: stops at the time or iteration limit.
 */
export function searchVrptw(m: VrptwModel, options: SearchOptions): SearchResult {
  const now = options.now ?? (() => performance.now())
  const began = now()
  const random = createRandom(options.seed ?? 1)
  const unreachable: number[] = []
  const start = options.initial ? Solution.from(m, options.initial) : Solution.empty(m)
  const placed = new Set(options.initial?.flat())
  for (let i = 0; i < m.n; i++) {
    if (placed.has(i)) continue
    let any = false
    for (let k = 0; k < m.v && !any; k++) any = servableAlone(m, k, i)
    if (any) start.unserved.push(i)
    else unreachable.push(i)
  }
  repair(start, 2)
  localSearch(start)
  const share = options.reduceShare ?? REDUCE_SHARE
  let current = start
  if (start.unserved.length > 0 && share > 0) {
    const limit = options.maxIterations
    const reduced = start.copy()
    emptyPool(reduced, {
      deadline: began + share * options.timeLimitMs,
      now,
      random,
      maxSteps: limit === undefined ? undefined : limit * share,
    })
    localSearch(reduced)
    // Ejection may end with heavier stops out than it began with (a day too full to serve all).
    if (!better(keyOf(start), keyOf(reduced))) current = reduced
  }
  let best = current.copy()
  let bestKey = keyOf(best)
  const penaltyUnit = penaltyScale(m)
  const score = (s: Solution) => s.distance() + penaltyUnit * s.penalty()
  let curScore = score(current)
  const t0 = (START_WORSE * Math.max(current.distance(), 1e-6)) / Math.LN2
  const weightsD = DESTROYS.map(() => 1)
  const weightsR = REPAIRS.map(() => 1)
  const scoresD = DESTROYS.map(() => 0)
  const scoresR = REPAIRS.map(() => 0)
  const usesD = DESTROYS.map(() => 0)
  const usesR = REPAIRS.map(() => 0)
  const served = m.n - unreachable.length
  const qMin = Math.min(4, served)
  const qMax = Math.min(60, Math.max(qMin, Math.round(served * 0.3)))
  const noise = 0.025 * maxDist(m)
  const limit = options.maxIterations ?? Infinity
  let it = 0
  for (; it < limit; it++) {
    const elapsed = now() - began
    if (elapsed >= options.timeLimitMs || served === 0) break
    const frac = Number.isFinite(limit) ? it / limit : elapsed / options.timeLimitMs
    const temperature = t0 * END_RATIO ** frac
    const d = roulette(weightsD, random)
    const r = roulette(weightsR, random)
    const cand = current.copy()
    const q = qMin + randomInt(random, qMax - qMin + 1)
    DESTROYS[d](cand, q, random)
    const [k, noisy] = REPAIRS[r]
    repair(cand, k, noisy ? noise : 0, random)
    let candScore = score(cand)
    // Never trade a served stop for distance once the best serves it.
    if (cand.penalty() > bestKey.penalty) candScore = Infinity
    if (cand.penalty() <= bestKey.penalty && candScore < score(best) * 1.01) {
      localSearch(cand)
      candScore = score(cand)
    }
    let sigma = -1
    const key = keyOf(cand)
    if (better(key, bestKey)) {
      best = cand.copy()
      bestKey = key
      sigma = 0
    } else if (candScore < curScore - 1e-9) sigma = 1
    const accept =
      candScore < curScore - 1e-9 ||
      random() < Math.exp(-(candScore - curScore) / Math.max(temperature, 1e-12))
    if (accept) {
      if (sigma < 0 && candScore !== curScore) sigma = 2
      current = cand
      curScore = candScore
    }
    usesD[d]++
    usesR[r]++
    if (sigma >= 0) {
      scoresD[d] += SIGMA[sigma]
      scoresR[r] += SIGMA[sigma]
    }
    if ((it + 1) % SEGMENT === 0) {
      adapt(weightsD, scoresD, usesD)
      adapt(weightsR, scoresR, usesR)
    }
  }
  return { solution: best, unreachable, iterations: it }
}

function keyOf(s: Solution) {
  return { penalty: s.penalty(), distance: s.distance() }
}

/** A price per unit of unserved weight large enough that serving a stop almost always pays. */
function penaltyScale(m: VrptwModel): number {
  let worst = 0
  for (let i = 0; i < m.n; i++) {
    for (let k = 0; k < m.v; k++) {
      const d = m.n + k
      worst = Math.max(worst, m.dist[d * m.size + i] + m.dist[i * m.size + d])
    }
  }
  return 2 * worst + 1
}

function maxDist(m: VrptwModel): number {
  let mx = 0
  for (let i = 0; i < m.dist.length; i++) if (m.dist[i] > mx) mx = m.dist[i]
  return mx
}

function roulette(weights: number[], random: () => number): number {
  let total = 0
  for (const w of weights) total += w
  let x = random() * total
  for (let i = 0; i < weights.length; i++) {
    x -= weights[i]
    if (x < 0) return i
  }
  return weights.length - 1
}

function adapt(weights: number[], scores: number[], uses: number[]): void {
  for (let i = 0; i < weights.length; i++) {
    if (uses[i] > 0) weights[i] = weights[i] * (1 - REACTION) + (REACTION * scores[i]) / uses[i]
    weights[i] = Math.max(weights[i], 0.05)
    scores[i] = 0
    uses[i] = 0
  }
}
