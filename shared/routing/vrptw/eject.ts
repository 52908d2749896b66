import { randomInt } from '../prng'
import { isAllowed } from './model'
import { feasibleStops } from './route'
import { bestPlace } from './repair'
import type { Solution } from './solution'

// Random relocations tried after each ejection (the paper uses 1,000 random moves).
const SHAKE_TRIES = 1000

export interface EjectOptions {
  deadline: number
  now: () => number
  random: () => number
  /** most stops ejected to make room for one */
  maxEject?: number
  /** most stops taken from the pool (keeps the phase deterministic under an iteration budget) */
  maxSteps?: number
}

/**
 * Route-count reduction with an ejection pool (Y. Nagata and O. Bräysy, "A powerful route
 * minimization heuristic for the vehicle routing problem with time windows", Operations Research
 * Letters 37, 2009), simplified: take a stop from the pool; insert it where it fits; otherwise put it
 * in while ejecting up to `maxEject` stops of one route whose failure counters p sum least (p of the
 * stop that did not fit goes up), push the ejected to the pool, and shake the solution with random
 * feasible relocations. Every route stays feasible throughout. Returns true when the pool empties.
 */
export function emptyPool(s: Solution, o: EjectOptions): boolean {
  const m = s.m
  const p = new Float64Array(m.n).fill(1)
  const pool = s.unserved
  s.unserved = []
  const place = { delta: 0, at: 0 }
  const maxSteps = o.maxSteps ?? Infinity
  for (let step = 0; pool.length > 0 && step < maxSteps && o.now() < o.deadline; step++) {
    // Heavier (higher-priority) stops first; among equals the last one in (a stack, as in the paper).
    let pick = pool.length - 1
    for (let i = pool.length - 1; i >= 0; i--) if (m.weight[pool[i]] > m.weight[pool[pick]]) pick = i
    const v = pool.splice(pick, 1)[0]
    let bestR = -1
    let bestAt = -1
    let bestDelta = Infinity
    for (let r = 0; r < s.routes.length; r++) {
      bestPlace(m, s.routes[r], v, place)
      if (place.delta < bestDelta) {
        bestDelta = place.delta
        bestR = r
        bestAt = place.at
      }
    }
    if (bestR >= 0) {
      s.routes[bestR].insert(v, bestAt)
      continue
    }
    p[v] += 1
    const ejected = ejectFor(s, v, p, o.maxEject ?? 3, o.random)
    if (ejected === null) {
      // Nothing can make room for it now; keep it for the distance phase to try again.
      s.unserved.push(v)
      continue
    }
    pool.push(...ejected)
    shake(s, o.random, SHAKE_TRIES)
  }
  s.unserved.push(...pool)
  return s.unserved.length === 0
}

/** Puts v into the route/position needing the cheapest ejection (sum of p, then fewest); returns the ejected. */
function ejectFor(
  s: Solution,
  v: number,
  p: Float64Array,
  maxEject: number,
  random: () => number,
): number[] | null {
  const m = s.m
  let best: { r: number; stops: number[]; out: number[] } | null = null
  let bestSum = Infinity
  const order = s.routes.map((_, r) => r)
  for (let i = order.length - 1; i > 0; i--) {
    const j = randomInt(random, i + 1)
    ;[order[i], order[j]] = [order[j], order[i]]
  }
  for (const r of order) {
    const route = s.routes[r]
    if (!isAllowed(m, route.k, v) || m.demand[v] > m.capacity[route.k]) continue
    const stops = route.stops()
    const L = stops.length
    const tryOut = (out: number[], sum: number) => {
      if (sum >= bestSum) return
      const kept = stops.filter((x) => !out.includes(x))
      for (let at = 0; at <= kept.length; at++) {
        const cand = [...kept.slice(0, at), v, ...kept.slice(at)]
        if (feasibleStops(m, route.k, cand)) {
          best = { r, stops: cand, out }
          bestSum = sum
          return
        }
      }
    }
    for (let a = 0; a < L; a++) {
      tryOut([stops[a]], p[stops[a]])
      if (maxEject < 2) continue
      for (let b = a + 1; b < L; b++) {
        const sum2 = p[stops[a]] + p[stops[b]]
        if (sum2 >= bestSum) continue
        tryOut([stops[a], stops[b]], sum2)
        if (maxEject < 3) continue
        for (let c = b + 1; c < L; c++) {
          const sum3 = sum2 + p[stops[c]]
          if (sum3 < bestSum) tryOut([stops[a], stops[b], stops[c]], sum3)
        }
      }
    }
  }
  if (best === null) return null
  const { r, stops, out } = best as { r: number; stops: number[]; out: number[] }
  const route = s.routes[r]
  route.nodes = [route.nodes[0], ...stops, route.nodes[route.nodes.length - 1]]
  route.update()
  return out
}

/** Random feasible relocations of single stops, whatever they cost: moves the search elsewhere. */
function shake(s: Solution, random: () => number, tries: number): void {
  const m = s.m
  for (let t = 0; t < tries; t++) {
    const A = s.routes[randomInt(random, s.routes.length)]
    if (A.stopCount === 0) continue
    const B = s.routes[randomInt(random, s.routes.length)]
    if (A === B) continue
    const pos = 1 + randomInt(random, A.stopCount)
    const x = A.nodes[pos]
    const a = A.nodes[pos - 1]
    const b = A.nodes[pos + 1]
    if (A.early[pos - 1] + m.service[a] + m.time[a * m.size + b] > A.late[pos + 1]) continue
    if (!isAllowed(m, B.k, x) || B.load + m.demand[x] > m.capacity[B.k]) continue
    const at = 1 + randomInt(random, B.nodes.length - 1)
    if (B.insertDelta(x, at) === Infinity) continue
    A.removeAt(pos)
    B.insert(x, at)
  }
}
