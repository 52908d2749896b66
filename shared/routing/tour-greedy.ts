import type { CostModel } from './cost-model'

/**
 * Greedy-edge start for symmetric costs: take candidate edges shortest first whenever both ends
 * still have a free side and no loop closes, then chain the resulting paths end to nearest end.
 * Johnson and McGeoch (1997, §2.1 and §3) report it about 16–19 % over optimal against
 * nearest neighbour's 25 %, and the best start for 2-opt, 3-opt and Lin–Kernighan: the local
 * search ends shorter and sooner from it. Candidate edges come from the neighbour lists, O(n·k log).
 */
export function greedyEdgeTour(model: CostModel, neighbours: Int32Array, k: number): Int32Array {
  const { n, cost } = model
  const from: number[] = []
  const to: number[] = []
  for (let i = 0; i < n; i++) {
    for (let s = i * k; s < i * k + k; s++) {
      const j = neighbours[s]
      // Each pair once: from the smaller index, or from j's side when i is not on j's list.
      if (i < j || !listed(neighbours, k, j, i)) {
        from.push(i)
        to.push(j)
      }
    }
  }
  const adj = new Int32Array(2 * n).fill(-1)
  const parent = Int32Array.from({ length: n }, (_, i) => i)
  const root = (a: number): number => {
    while (parent[a] !== a) a = parent[a] = parent[parent[a]]
    return a
  }
  const link = (a: number, b: number) => {
    parent[root(a)] = root(b)
    adj[adj[2 * a] < 0 ? 2 * a : 2 * a + 1] = b
    adj[adj[2 * b] < 0 ? 2 * b : 2 * b + 1] = a
  }
  addShortestFirst(
    cost,
    from,
    to,
    (a, b) => adj[2 * a + 1] < 0 && adj[2 * b + 1] < 0 && root(a) !== root(b),
    link,
  )
  // The lists leave paths whose ends have no listed partner left: repeat greedy over the ends alone,
  // each end offering its nearest ends on other paths, until one path remains (each round joins at
  // least the closest such pair, so it ends; the rounds shrink fast, the first costs O(ends²)).
  for (;;) {
    const ends: number[] = []
    for (let i = 0; i < n; i++) if (adj[2 * i + 1] < 0) ends.push(i)
    if (ends.length <= 2) break
    from.length = 0
    to.length = 0
    const keys = new Float64Array(k)
    const picks = new Int32Array(k)
    for (const a of ends) {
      let size = 0
      for (const b of ends) {
        if (root(a) === root(b)) continue
        const key = cost(a, b)
        if (size === k && key >= keys[k - 1]) continue
        let slot = size < k ? size++ : k - 1
        for (; slot > 0 && keys[slot - 1] > key; slot--) {
          keys[slot] = keys[slot - 1]
          picks[slot] = picks[slot - 1]
        }
        keys[slot] = key
        picks[slot] = b
      }
      for (let s = 0; s < size; s++) {
        from.push(a)
        to.push(picks[s])
      }
    }
    addShortestFirst(
      cost,
      from,
      to,
      (a, b) => adj[2 * a + 1] < 0 && adj[2 * b + 1] < 0 && root(a) !== root(b),
      link,
    )
  }
  return walk(n, adj)
}

function addShortestFirst(
  cost: (i: number, j: number) => number,
  from: number[],
  to: number[],
  allowed: (a: number, b: number) => boolean,
  link: (a: number, b: number) => void,
): void {
  const lengths = Float64Array.from(from, (a, e) => cost(a, to[e]))
  const edges = Array.from(from.keys()).sort((x, y) => lengths[x] - lengths[y] || x - y)
  for (const e of edges) if (allowed(from[e], to[e])) link(from[e], to[e])
}

function listed(neighbours: Int32Array, k: number, i: number, j: number): boolean {
  for (let s = i * k; s < i * k + k; s++) if (neighbours[s] === j) return true
  return false
}

/** The stops along the one remaining path, from one end to the other. */
function walk(n: number, adj: Int32Array): Int32Array {
  const order = new Int32Array(n)
  let start = 0
  while (adj[2 * start + 1] >= 0) start++
  let previous = -1
  let current = start
  for (let filled = 0; filled < n; filled++) {
    order[filled] = current
    const next = adj[2 * current] === previous ? adj[2 * current + 1] : adj[2 * current]
    previous = current
    current = next
  }
  return order
}
