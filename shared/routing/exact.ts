import type { CostModel } from './cost-model'

/** Instances this small are solved exactly; the table has 2^(n-1)·n entries. */
export const EXACT_MAX_STOPS = 12

/**
 * Optimal tour by dynamic programming over subsets (M. Held and R. M. Karp, "A Dynamic
 * Programming Approach to Sequencing Problems", J. SIAM 10(1), 1962). Works for directed costs.
 */
export function exactTour(model: CostModel, start: number): Int32Array {
  const { n, cost } = model
  const others: number[] = []
  for (let i = 0; i < n; i++) if (i !== start) others.push(i)
  const m = others.length
  const full = 1 << m
  // best[mask * m + j]: cheapest path from start through the set `mask`, ending at others[j].
  const best = new Float64Array(full * m).fill(Infinity)
  const from = new Int8Array(full * m).fill(-1)
  for (let j = 0; j < m; j++) best[(1 << j) * m + j] = cost(start, others[j])
  for (let mask = 1; mask < full; mask++) {
    for (let j = 0; j < m; j++) {
      const here = best[mask * m + j]
      if (!(mask & (1 << j)) || here === Infinity) continue
      for (let t = 0; t < m; t++) {
        if (mask & (1 << t)) continue
        const next = mask | (1 << t)
        const value = here + cost(others[j], others[t])
        if (value < best[next * m + t]) {
          best[next * m + t] = value
          from[next * m + t] = j
        }
      }
    }
  }
  let end = 0
  let total = Infinity
  for (let j = 0; j < m; j++) {
    const value = best[(full - 1) * m + j] + cost(others[j], start)
    if (value < total) {
      total = value
      end = j
    }
  }
  const order = new Int32Array(n)
  order[0] = start
  let mask = full - 1
  for (let slot = n - 1; slot >= 1; slot--) {
    order[slot] = others[end]
    const prev = from[mask * m + end]
    mask &= ~(1 << end)
    end = prev
  }
  return order
}
