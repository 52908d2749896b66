// Small seeded PRNG so a forecast is repeatable: sfc32 ("small fast chaotic", Chris Doty-Humphrey,
// PractRand), 32-bit state words; it passes PractRand and BigCrush in its author's tests.
export type Random = () => number

export function createRandom(seed: number): Random {
  let a = 0x9e3779b9
  let b = 0x243f6a88
  let c = 0xb7e15162
  let d = seed >>> 0
  const next = () => {
    const t = (((a + b) | 0) + d) | 0
    d = (d + 1) | 0
    a = b ^ (b >>> 9)
    b = (c + (c << 3)) | 0
    c = (c << 21) | (c >>> 11)
    c = (c + t) | 0
    // [0, 1) with 32 random bits
    return (t >>> 0) / 4294967296
  }
  // Warm-up rounds so nearby seeds give unrelated streams.
  for (let i = 0; i < 15; i++) next()
  return next
}

// Unit exponential draw; 1 − u lies in (0, 1] so the logarithm is always finite.
export function unitExponential(random: Random): number {
  return -Math.log(1 - random())
}

// Largest of m unit exponentials in one draw: its CDF is (1 − e^−x)^m, so x = −ln(1 − U^(1/m)).
export function maxOfUnitExponentials(random: Random, m: number): number {
  return -Math.log(-Math.expm1(Math.log(random()) / m))
}
