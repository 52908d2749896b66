import type { CostModel } from './cost-model'

/**
 * Nearest-neighbour tour from `start`: O(n·k) while a candidate-list neighbour is still free, with
 * a full scan otherwise. Its ~25 % excess (Johnson & McGeoch 1997) is removed by the local search.
 */
export function nearestNeighbourTour(
  model: CostModel,
  neighbours: Int32Array,
  k: number,
  start: number,
): Int32Array {
  const { n, cost } = model
  const order = new Int32Array(n)
  const used = new Uint8Array(n)
  let current = start
  used[current] = 1
  order[0] = current
  for (let step = 1; step < n; step++) {
    let next = -1
    let best = Infinity
    for (let i = current * k; i < current * k + k; i++) {
      const j = neighbours[i]
      if (!used[j] && cost(current, j) < best) {
        best = cost(current, j)
        next = j
      }
    }
    if (next < 0) {
      for (let j = 0; j < n; j++) {
        if (!used[j] && cost(current, j) < best) {
          best = cost(current, j)
          next = j
        }
      }
    }
    used[next] = 1
    order[step] = next
    current = next
  }
  return order
}
