import { swapStops, twoOptStar } from './exchange'
import { isAllowed, type VrptwModel } from './model'
import { feasibleStops, type Route } from './route'
import type { Solution } from './solution'

const EPS = 1e-9

/**
 * Descent to a local optimum with the classic VRPTW moves (O. Bräysy and M. Gendreau, "Vehicle
 * routing problem with time windows, part I: route construction and local search algorithms",
 * Transportation Science 39(1), 2005): moving a segment of 1–3 stops within or between routes
 * (relocate, Or-opt), exchanging two stops between routes (swap) and exchanging route ends (2-opt*).
 * Between routes every move is checked in O(1) (or O(segment)) with the routes' time slack;
 * within a route the distance change is checked first and only improving moves are scanned.
 */
export function localSearch(s: Solution, maxRounds = 50): void {
  for (let round = 0; round < maxRounds; round++) {
    let moved = false
    for (let len = 1; len <= 3; len++) if (moveSegments(s, len)) moved = true
    if (swapStops(s)) moved = true
    if (twoOptStar(s)) moved = true
    if (!moved) return
  }
}

/** Whether removing positions p..p+len-1 keeps route r feasible (matters without triangle inequality). */
function canCut(m: VrptwModel, r: Route, p: number, len: number): boolean {
  const a = r.nodes[p - 1]
  const b = r.nodes[p + len]
  return r.early[p - 1] + m.service[a] + m.time[a * m.size + b] <= r.late[p + len]
}

function moveSegments(s: Solution, len: number): boolean {
  const { m } = s
  const S = m.size
  const D = m.dist
  let moved = false
  for (const A of s.routes) {
    for (let p = 1; p + len < A.nodes.length; p++) {
      const nd = A.nodes
      const first = nd[p]
      const last = nd[p + len - 1]
      const a = nd[p - 1]
      const b = nd[p + len]
      const gain = D[a * S + first] + D[last * S + b] - D[a * S + b]
      if (gain <= EPS) continue
      if (!canCut(m, A, p, len)) continue
      let segLoad = 0
      for (let i = p; i < p + len; i++) segLoad += m.demand[nd[i]]
      if (tryOtherRoutes(s, A, p, len, gain, segLoad) || tryWithin(s, A, p, len, gain)) {
        moved = true
        p = Math.max(0, p - 1)
      }
    }
  }
  return moved
}

function tryOtherRoutes(
  s: Solution,
  A: Route,
  p: number,
  len: number,
  gain: number,
  segLoad: number,
): boolean {
  const { m } = s
  const S = m.size
  const D = m.dist
  const seg = A.nodes.slice(p, p + len)
  const first = seg[0]
  const last = seg[len - 1]
  const emptyTried = new Set<number>()
  for (const B of s.routes) {
    if (B === A || B.load + segLoad > m.capacity[B.k]) continue
    if (B.stopCount === 0) {
      const cls = m.vehicleClass[B.k]
      if (emptyTried.has(cls)) continue
      emptyTried.add(cls)
    }
    if (!seg.every((x) => isAllowed(m, B.k, x))) continue
    for (let q = 1; q < B.nodes.length; q++) {
      const c = B.nodes[q - 1]
      const e = B.nodes[q]
      const add = D[c * S + first] + D[last * S + e] - D[c * S + e]
      if (add - gain >= -EPS) continue
      let t = B.early[q - 1]
      let prev = c
      let ok = true
      for (const x of seg) {
        t = Math.max(t + m.service[prev] + m.time[prev * S + x], m.ready[x])
        if (t > m.due[x]) {
          ok = false
          break
        }
        prev = x
      }
      if (!ok || t + m.service[prev] + m.time[prev * S + e] > B.late[q]) continue
      A.nodes.splice(p, len)
      A.update()
      B.nodes.splice(q, 0, ...seg)
      B.update()
      return true
    }
  }
  return false
}

function tryWithin(s: Solution, A: Route, p: number, len: number, gain: number): boolean {
  const { m } = s
  const S = m.size
  const D = m.dist
  const nd = A.nodes
  const first = nd[p]
  const last = nd[p + len - 1]
  // Put the segment between nd[q - 1] and nd[q]; q in p..p+len would leave it where it is.
  for (let q = 1; q < nd.length; q++) {
    if (q >= p && q <= p + len) continue
    const c = nd[q - 1]
    const e = nd[q]
    if (D[c * S + first] + D[last * S + e] - D[c * S + e] - gain >= -EPS) continue
    const seg = nd.slice(p, p + len)
    const stops =
      q < p
        ? [...nd.slice(1, q), ...seg, ...nd.slice(q, p), ...nd.slice(p + len, -1)]
        : [...nd.slice(1, p), ...nd.slice(p + len, q), ...seg, ...nd.slice(q, -1)]
    if (!feasibleStops(m, A.k, stops)) continue
    A.nodes = [nd[0], ...stops, nd[nd.length - 1]]
    A.update()
    return true
  }
  return false
}
