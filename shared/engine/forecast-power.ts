// x^γ for x ≥ 0 without Math.pow in the forecast's hot loop (a Weibull threshold per failure). Split
// x = m · 2^e with m in [1, 2): 2^(eγ) comes from a table over e, and m^γ from a cubic Hermite piece
// on one of 256 cells of [1, 2), built from m^γ and its derivative at the cell's ends. The cubic's
// error is at most h⁴/384 · max|f⁗| (h = 1/256), below 1e-12 relative for γ up to 1 and about
// 1e-10 at γ = 5 (the schema's largest, shape 0.2): far below any Monte Carlo error. About twice as
// fast as exp(log(x) · γ) in V8 (measured here).
const CELLS = 256
const EXPONENTS = 2048

// The high word of a double: its sign, its 11-bit biased exponent and the top of its mantissa.
const word = new Float64Array(1)
const words = new Uint32Array(word.buffer)
word[0] = 1
const HIGH = words[1] === 0x3ff00000 ? 1 : 0

// 2^−(e − 1023) for each biased exponent: scales x into [1, 2) by one exact multiplication.
const unscale = Float64Array.from({ length: EXPONENTS }, (_, e) => 2 ** -(e - 1023))

/** The tables of one exponent γ: 2^(eγ) per biased exponent e, and the cubics of m^γ. */
export interface PowerTable {
  gamma: number
  scale: Float64Array
  coef: Float64Array
}

function build(gamma: number): PowerTable {
  const scale = Float64Array.from({ length: EXPONENTS }, (_, e) => 2 ** ((e - 1023) * gamma))
  const coef = new Float64Array(CELLS * 4)
  const h = 1 / CELLS
  for (let k = 0; k < CELLS; k++) {
    const m0 = 1 + k * h
    const m1 = m0 + h
    const f0 = m0 ** gamma
    const f1 = m1 ** gamma
    const d0 = gamma * m0 ** (gamma - 1) * h
    const d1 = gamma * m1 ** (gamma - 1) * h
    coef[4 * k] = f0
    coef[4 * k + 1] = d0
    coef[4 * k + 2] = 3 * (f1 - f0) - 2 * d0 - d1
    coef[4 * k + 3] = 2 * (f0 - f1) + d0 + d1
  }
  return { gamma, scale, coef }
}

/** x^γ to about 1e-12 relative (1e-10 for γ near 5). One function for every γ, so V8 inlines it. */
export function power(p: PowerTable, x: number): number {
  word[0] = x
  const e = words[HIGH] >>> 20
  // Zero, subnormals, negatives, infinities and NaN: rare, left to Math.pow.
  if (e === 0 || e >= 2047) return x ** p.gamma
  const s = (x * unscale[e] - 1) * CELLS
  const k = s | 0
  const t = s - k
  const b = 4 * k
  const c = p.coef
  return p.scale[e] * (c[b] + t * (c[b + 1] + t * (c[b + 2] + t * c[b + 3])))
}

// A forecast uses one shape; keep the last few tables (building one takes a few thousand pows).
const cache = new Map<number, PowerTable>()

export function powerTable(gamma: number): PowerTable {
  let p = cache.get(gamma)
  if (!p) {
    if (cache.size >= 8) cache.delete(cache.keys().next().value!)
    p = build(gamma)
    cache.set(gamma, p)
  }
  return p
}
