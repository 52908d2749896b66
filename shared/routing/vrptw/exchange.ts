import { isAllowed, type VrptwModel } from './model'
import type { Route } from './route'
import type { Solution } from './solution'

// Moves between two routes for local-search.ts, each checked in O(1) with the routes' time slack.

const EPS = 1e-9

/** Whether y fits between positions p-1 and p+1 of r in place of r.nodes[p]. */
function replaceFits(m: VrptwModel, r: Route, p: number, y: number): boolean {
  const S = m.size
  const a = r.nodes[p - 1]
  const b = r.nodes[p + 1]
  const t = Math.max(r.early[p - 1] + m.service[a] + m.time[a * S + y], m.ready[y])
  return t <= m.due[y] && t + m.service[y] + m.time[y * S + b] <= r.late[p + 1]
}

export function swapStops(s: Solution): boolean {
  const { m } = s
  const S = m.size
  const D = m.dist
  let moved = false
  const R = s.routes
  for (let i = 0; i < R.length; i++) {
    for (let j = i + 1; j < R.length; j++) {
      const A = R[i]
      const B = R[j]
      for (let p = 1; p < A.nodes.length - 1; p++) {
        for (let q = 1; q < B.nodes.length - 1; q++) {
          const x = A.nodes[p]
          const y = B.nodes[q]
          const a0 = A.nodes[p - 1]
          const a1 = A.nodes[p + 1]
          const b0 = B.nodes[q - 1]
          const b1 = B.nodes[q + 1]
          const delta =
            D[a0 * S + y] +
            D[y * S + a1] -
            D[a0 * S + x] -
            D[x * S + a1] +
            D[b0 * S + x] +
            D[x * S + b1] -
            D[b0 * S + y] -
            D[y * S + b1]
          if (delta >= -EPS) continue
          const dq = m.demand[y] - m.demand[x]
          if (A.load + dq > m.capacity[A.k] || B.load - dq > m.capacity[B.k]) continue
          if (!isAllowed(m, A.k, y) || !isAllowed(m, B.k, x)) continue
          if (!replaceFits(m, A, p, y) || !replaceFits(m, B, q, x)) continue
          A.nodes[p] = y
          B.nodes[q] = x
          A.update()
          B.update()
          moved = true
        }
      }
    }
  }
  return moved
}

/** Exchanges the ends of two routes (J.-Y. Potvin and J.-M. Rousseau 1995): A[..i] + B[j+1..], B[..j] + A[i+1..]. */
export function twoOptStar(s: Solution): boolean {
  const { m } = s
  const S = m.size
  const D = m.dist
  const T = m.time
  let moved = false
  const R = s.routes
  for (let u = 0; u < R.length; u++) {
    for (let w = 0; w < R.length; w++) {
      const A = R[u]
      const B = R[w]
      if (u === w || m.endGroup[A.k] !== m.endGroup[B.k]) continue
      if (A.stopCount === 0) continue
      for (let i = 0; i < A.nodes.length - 1; i++) {
        for (let j = 0; j < B.nodes.length - 1; j++) {
          const a = A.nodes[i]
          const a1 = A.nodes[i + 1]
          const b = B.nodes[j]
          const b1 = B.nodes[j + 1]
          const delta = D[a * S + b1] + D[b * S + a1] - D[a * S + a1] - D[b * S + b1]
          if (delta >= -EPS) continue
          if (A.early[i] + m.service[a] + T[a * S + b1] > B.late[j + 1]) continue
          if (B.early[j] + m.service[b] + T[b * S + a1] > A.late[i + 1]) continue
          const loadA = A.loadTo[i] + B.load - B.loadTo[j]
          const loadB = B.loadTo[j] + A.load - A.loadTo[i]
          if (loadA > m.capacity[A.k] || loadB > m.capacity[B.k]) continue
          const tailA = A.nodes.slice(i + 1, -1)
          const tailB = B.nodes.slice(j + 1, -1)
          if (
            m.allowed &&
            (!tailB.every((x) => isAllowed(m, A.k, x)) || !tailA.every((x) => isAllowed(m, B.k, x)))
          )
            continue
          const endA = A.nodes[A.nodes.length - 1]
          const endB = B.nodes[B.nodes.length - 1]
          A.nodes = [...A.nodes.slice(0, i + 1), ...tailB, endA]
          B.nodes = [...B.nodes.slice(0, j + 1), ...tailA, endB]
          A.update()
          B.update()
          moved = true
          break
        }
      }
    }
  }
  return moved
}
