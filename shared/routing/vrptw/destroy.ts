import { randomInt } from '../prng'
import type { VrptwModel } from './model'
import type { Solution } from './solution'

const largest = new WeakMap<VrptwModel, number>()

/** Largest distance between two stops, worked out once per model. */
function largestDistance(m: VrptwModel): number {
  let mx = largest.get(m)
  if (mx === undefined) {
    mx = 1e-9
    for (let a = 0; a < m.n; a++) for (let b = 0; b < m.n; b++) mx = Math.max(mx, m.dist[a * m.size + b])
    largest.set(m, mx)
  }
  return mx
}

export type Destroy = (s: Solution, q: number, random: () => number) => void

/** Served stops in route order. */
function served(s: Solution): number[] {
  const out: number[] = []
  for (const r of s.routes) for (let p = 1; p < r.nodes.length - 1; p++) out.push(r.nodes[p])
  return out
}

/** Random removal (Ropke and Pisinger 2006, §4.2.3). */
export const randomRemoval: Destroy = (s, q, random) => {
  const pool = served(s)
  const out: number[] = []
  for (let i = 0; i < q && pool.length > 0; i++) {
    const j = randomInt(random, pool.length)
    out.push(pool[j])
    pool[j] = pool[pool.length - 1]
    pool.pop()
  }
  s.removeStops(out)
}

/**
 * Worst removal (§4.2.2): stops whose removal saves most distance, chosen with randomness y^p (p = 3),
 * savings computed once per call.
 */
export const worstRemoval: Destroy = (s, q, random) => {
  const { m } = s
  const S = m.size
  const list: { x: number; gain: number }[] = []
  for (const r of s.routes) {
    const nd = r.nodes
    for (let p = 1; p < nd.length - 1; p++) {
      const a = nd[p - 1]
      const x = nd[p]
      const b = nd[p + 1]
      list.push({ x, gain: m.dist[a * S + x] + m.dist[x * S + b] - m.dist[a * S + b] })
    }
  }
  list.sort((u, w) => w.gain - u.gain || u.x - w.x)
  const out: number[] = []
  for (let i = 0; i < q && list.length > 0; i++) {
    const j = Math.floor(random() ** 3 * list.length)
    out.push(list[j].x)
    list.splice(j, 1)
  }
  s.removeStops(out)
}

/**
 * Shaw (related) removal (P. Shaw 1998; weights of Ropke and Pisinger 2006, §4.2.1: distance 9,
 * start time 3, demand 2, randomness p = 6): removes stops related to ones already removed.
 */
export const shawRemoval: Destroy = (s, q, random) => {
  const { m } = s
  const S = m.size
  const pool = served(s)
  if (pool.length === 0) return
  const maxD = largestDistance(m)
  let maxT = 1e-9
  let maxQ = 1e-9
  const start = new Float64Array(m.n)
  for (const r of s.routes) for (let p = 1; p < r.nodes.length - 1; p++) start[r.nodes[p]] = r.early[p]
  for (const a of pool) {
    maxT = Math.max(maxT, start[a])
    maxQ = Math.max(maxQ, m.demand[a])
  }
  const rel = (a: number, b: number) =>
    (9 * m.dist[a * S + b]) / maxD +
    (3 * Math.abs(start[a] - start[b])) / maxT +
    (2 * Math.abs(m.demand[a] - m.demand[b])) / maxQ
  const first = randomInt(random, pool.length)
  const out = [pool[first]]
  pool.splice(first, 1)
  const key = new Float64Array(m.n)
  while (out.length < q && pool.length > 0) {
    const ref = out[randomInt(random, out.length)]
    for (const x of pool) key[x] = rel(ref, x)
    pool.sort((a, b) => key[a] - key[b] || a - b)
    const j = Math.floor(random() ** 6 * pool.length)
    out.push(pool[j])
    pool.splice(j, 1)
  }
  s.removeStops(out)
}

/**
 * Route removal: empties one route, small routes more likely, then tops up with random removal.
 * Gives the repair a chance to serve everything with one route fewer.
 */
export const routeRemoval: Destroy = (s, q, random) => {
  const used = s.routes.filter((r) => r.stopCount > 0).sort((a, b) => a.stopCount - b.stopCount || a.k - b.k)
  if (used.length === 0) return
  const r = used[Math.floor(random() ** 2 * used.length)]
  const stops = r.stops()
  s.removeStops(stops)
  if (stops.length < q) randomRemoval(s, q - stops.length, random)
}
