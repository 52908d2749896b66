import { isAllowed, type VrptwModel } from './model'
import type { Route } from './route'
import type { Solution } from './solution'

// Stands in for "cannot go in this route" in regret sums, so that stops with fewer options go first.
const NO_ROUTE = 1e7

/** Cheapest feasible place for stop x in route r: delta distance and position (Infinity, -1 if none). */
export function bestPlace(m: VrptwModel, r: Route, x: number, out: { delta: number; at: number }): void {
  out.delta = Infinity
  out.at = -1
  if (!isAllowed(m, r.k, x) || r.load + m.demand[x] > m.capacity[r.k]) return
  const L = r.nodes.length
  for (let p = 1; p < L; p++) {
    const d = r.insertDelta(x, p)
    if (d < out.delta) {
      out.delta = d
      out.at = p
    }
  }
}

/**
 * Regret-k insertion of every stop in `s.unserved` (D. Pisinger and S. Ropke, "A general heuristic
 * for vehicle routing problems", Computers & OR 34, 2007, §2.2.2; k = 1 is greedy insertion): the
 * stop whose k best routes differ most from its best goes first, into its cheapest place. Insertion
 * costs per route are cached and recomputed only for the route that changed. `noise` (≥ 0) scales a
 * random perturbation of each cost (Ropke and Pisinger 2006, §5.3). Stops that fit nowhere stay in
 * `s.unserved`; the order of trying is by weight first, so higher-priority stops are placed first.
 */
export function repair(s: Solution, k: number, noise = 0, random: () => number = Math.random): void {
  const m = s.m
  const pending = s.unserved
  const R = s.routes.length
  const P = pending.length
  if (P === 0) return
  const delta = new Float64Array(P * R)
  const at = new Int32Array(P * R)
  const done = new Uint8Array(P)
  const place = { delta: 0, at: 0 }
  const fill = (r: number) => {
    const route = s.routes[r]
    for (let i = 0; i < P; i++) {
      if (done[i]) continue
      bestPlace(m, route, pending[i], place)
      delta[i * R + r] = place.delta + (noise > 0 && place.delta < Infinity ? noise * (random() * 2 - 1) : 0)
      at[i * R + r] = place.at
    }
  }
  for (let r = 0; r < R; r++) fill(r)
  const active: number[] = []
  const best = new Float64Array(k)
  for (let left = P; left > 0; left--) {
    // Only one empty route of each vehicle class is worth considering.
    const seenEmpty = new Set<number>()
    active.length = 0
    for (let r = 0; r < R; r++) {
      const route = s.routes[r]
      if (route.stopCount === 0) {
        const cls = m.vehicleClass[route.k]
        if (seenEmpty.has(cls)) continue
        seenEmpty.add(cls)
      }
      active.push(r)
    }
    let pick = -1
    let pickRoute = -1
    let pickWeight = -1
    let pickRegret = -Infinity
    let pickCost = Infinity
    for (let i = 0; i < P; i++) {
      if (done[i]) continue
      const w = m.weight[pending[i]]
      if (w < pickWeight) continue
      best.fill(Infinity)
      let bestRoute = -1
      for (const r of active) {
        const d = delta[i * R + r]
        if (d === Infinity) continue
        if (d < best[0]) bestRoute = r
        // keep the k smallest in order
        for (let j = 0; j < k; j++) {
          if (d < best[j]) {
            for (let q = k - 1; q > j; q--) best[q] = best[q - 1]
            best[j] = d
            break
          }
        }
      }
      if (bestRoute < 0) continue
      let regret = 0
      for (let j = 1; j < k; j++) regret += Math.min(best[j], NO_ROUTE) - best[0]
      const better =
        w > pickWeight || regret > pickRegret + 1e-9 || (regret > pickRegret - 1e-9 && best[0] < pickCost)
      if (better) {
        pick = i
        pickRoute = bestRoute
        pickWeight = w
        pickRegret = regret
        pickCost = best[0]
      }
    }
    if (pick < 0) break
    done[pick] = 1
    s.routes[pickRoute].insert(pending[pick], at[pick * R + pickRoute])
    fill(pickRoute)
  }
  s.unserved = pending.filter((_, i) => !done[i])
}
