// Closed form for the failure cascade of n equal lamps with exponential lifetimes (Weibull shape 1):
// Rényi representation for load-sharing systems / sequential order statistics (Kamps 1995), as
// given in trade-reference §3. After i failures each survivor fails at λi = λ0 · (n / (n − i))^p, so
// the gap to the next failure is exponential with rate (n − i) · λi.
function gapMeans(n: number, lambda0: number, p: number, k: number): number[] {
  if (!Number.isInteger(n) || !Number.isInteger(k) || k < 0 || k > n) {
    throw new RangeError(`k must be an integer from 0 to n (got n = ${n}, k = ${k})`)
  }
  if (!(lambda0 > 0)) throw new RangeError('lambda0 must be positive')
  const gaps: number[] = []
  for (let i = 0; i < k; i++) gaps.push(1 / ((n - i) * lambda0 * (n / (n - i)) ** p))
  return gaps
}

// E[T_k] = Σ_{i=0}^{k−1} 1 / ((n − i) · λi); with p = 0 this is (H_n − H_{n−k}) / λ0.
export function expectedTimeToKthFailure(n: number, lambda0: number, p: number, k: number): number {
  return gapMeans(n, lambda0, p, k).reduce((s, g) => s + g, 0)
}

// Var[T_k] = Σ 1 / ((n − i) · λi)², the gaps being independent exponentials.
export function varianceTimeToKthFailure(n: number, lambda0: number, p: number, k: number): number {
  return gapMeans(n, lambda0, p, k).reduce((s, g) => s + g * g, 0)
}
