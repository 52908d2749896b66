import type { CostModel } from './cost-model'

/**
 * k nearest neighbours of every stop (row i at [i*k, i*k+k), nearest first). Candidate lists keep
 * local search near-linear: improving 2-opt/Or-opt moves almost always join near neighbours
 * (D. S. Johnson and L. A. McGeoch, "The Traveling Salesman Problem: A Case Study in Local
 * Optimization", 1997, §3.3). A plain O(n²) scan is fast enough for the 5,000-stop limit.
 */
export function nearestNeighbours(model: CostModel, k: number): Int32Array {
  const { n, near } = model
  const lists = new Int32Array(n * k)
  const keys = new Float64Array(k)
  for (let i = 0; i < n; i++) {
    let size = 0
    const base = i * k
    for (let j = 0; j < n; j++) {
      if (j === i) continue
      const key = near(i, j)
      if (size === k && key >= keys[k - 1]) continue
      let slot = size < k ? size++ : k - 1
      while (slot > 0 && keys[slot - 1] > key) {
        keys[slot] = keys[slot - 1]
        lists[base + slot] = lists[base + slot - 1]
        slot--
      }
      keys[slot] = key
      lists[base + slot] = j
    }
  }
  return lists
}
