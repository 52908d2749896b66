// Independent reference computations for the routing tests (deliberately not the solver's code).

/** All tours starting at index 0, by enumeration: the true optimum for tiny instances. */
export function bruteForceOptimum(n: number, cost: (i: number, j: number) => number): number {
  let best = Infinity
  const rest = Array.from({ length: n - 1 }, (_, i) => i + 1)
  const permute = (k: number) => {
    if (k === rest.length) {
      const order = [0, ...rest]
      best = Math.min(best, closedTourCost(order, cost))
      return
    }
    for (let i = k; i < rest.length; i++) {
      ;[rest[k], rest[i]] = [rest[i], rest[k]]
      permute(k + 1)
      ;[rest[k], rest[i]] = [rest[i], rest[k]]
    }
  }
  permute(0)
  return best
}

export function closedTourCost(order: number[], cost: (i: number, j: number) => number): number {
  let total = 0
  for (let k = 0; k < order.length; k++) total += cost(order[k], order[(k + 1) % order.length])
  return total
}

/**
 * Great-circle distance, atan2 form of the haversine formula (Sinnott 1984), on the IUGG mean
 * Earth radius R1 = 6371008.8 m (Moritz, "Geodetic Reference System 1980").
 */
export function greatCircleMetres(a: { lat: number; lng: number }, b: { lat: number; lng: number }): number {
  const rad = Math.PI / 180
  const dLat = (b.lat - a.lat) * rad
  const dLng = (b.lng - a.lng) * rad
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(dLng / 2) ** 2
  return 2 * 6371008.8 * Math.atan2(Math.sqrt(h), Math.sqrt(1 - h))
}

/** Small deterministic generator for test data (LCG constants from Numerical Recipes, memory). */
export function lcg(seed: number): () => number {
  let s = seed >>> 0
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0
    return s / 4294967296
  }
}
