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

/**
 * Candidate lists for the tour search: quadrant neighbours when the model knows directions
 * (coordinates), else the k nearest (a travel matrix).
 */
export function candidateNeighbours(model: CostModel, k: number): Int32Array {
  return model.quadrant ? quadrantNeighbours(model, k, model.quadrant) : nearestNeighbours(model, k)
}

/**
 * Quadrant neighbours: up to ⌊k/4⌋ nearest stops in each quadrant around a stop, the rest of its k
 * slots filled with its nearest others, nearest first. On clustered or line-structured instances
 * the plain k nearest can all lie along one line or inside one cluster, so the edge the optimal
 * tour needs is never a candidate; quadrant lists keep one (Johnson and McGeoch 1997, §3.3; their
 * default for 3-opt and Lin–Kernighan).
 */
export function quadrantNeighbours(
  model: CostModel,
  k: number,
  quadrant: (i: number, j: number) => number,
): Int32Array {
  const { n, near } = model
  const perQuadrant = Math.floor(k / 4)
  const lists = new Int32Array(n * k)
  const quadKeys = new Float64Array(4 * perQuadrant)
  const quadIds = new Int32Array(4 * perQuadrant)
  const quadSize = new Int32Array(4)
  const keys = new Float64Array(k)
  const ids = new Int32Array(k)
  for (let i = 0; i < n; i++) {
    quadSize.fill(0)
    let size = 0
    // A stop no nearer than every list's last entry changes nothing: skip it before its quadrant.
    let quadWorst = perQuadrant > 0 ? Infinity : -Infinity
    for (let j = 0; j < n; j++) {
      if (j === i) continue
      const key = near(i, j)
      if (key >= quadWorst && size === k && key >= keys[k - 1]) continue
      size = insertSorted(keys, ids, 0, size, k, key, j)
      if (perQuadrant === 0 || key >= quadWorst) continue
      const q = quadrant(i, j)
      quadSize[q] = insertSorted(quadKeys, quadIds, q * perQuadrant, quadSize[q], perQuadrant, key, j)
      quadWorst = -Infinity
      for (let r = 0; r < 4; r++) {
        const last = quadSize[r] < perQuadrant ? Infinity : quadKeys[r * perQuadrant + perQuadrant - 1]
        if (last > quadWorst) quadWorst = last
      }
    }
    // The quadrant picks first, then the nearest others, without repeats; then nearest first.
    const chosen: number[] = []
    for (let q = 0; q < 4; q++)
      for (let s = 0; s < quadSize[q]; s++) chosen.push(quadIds[q * perQuadrant + s])
    for (let s = 0; s < size && chosen.length < k; s++) if (!chosen.includes(ids[s])) chosen.push(ids[s])
    chosen.sort((a, b) => near(i, a) - near(i, b) || a - b)
    for (let s = 0; s < k; s++) lists[i * k + s] = chosen[s]
  }
  return lists
}

/** Inserts (key, id) into the sorted run keys[base, base + size), capped at `cap`; returns the new size. */
function insertSorted(
  keys: Float64Array,
  ids: Int32Array,
  base: number,
  size: number,
  cap: number,
  key: number,
  id: number,
): number {
  if (size === cap && key >= keys[base + cap - 1]) return size
  let slot = size < cap ? size++ : cap - 1
  for (; slot > 0 && keys[base + slot - 1] > key; slot--) {
    keys[base + slot] = keys[base + slot - 1]
    ids[base + slot] = ids[base + slot - 1]
  }
  keys[base + slot] = key
  ids[base + slot] = id
  return size
}
