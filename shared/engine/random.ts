// Small seeded PRNG so a forecast is repeatable: sfc32 ("small fast chaotic", Chris Doty-Humphrey,
// PractRand), 32-bit state words; it passes PractRand and BigCrush in its author's tests.
export type Random = () => number

/**
 * The generator's four state words. The hot loops pass this array to the module-level functions below
 * (one function each, so V8 inlines them and no draw is boxed); `createRandom` wraps it for the rest.
 */
export type RandomState = Int32Array

export function randomState(seed: number): RandomState {
  const st = Int32Array.of(0x9e3779b9, 0x243f6a88, 0xb7e15162, seed >>> 0)
  // Warm-up rounds so nearby seeds give unrelated streams.
  for (let i = 0; i < 15; i++) next32(st)
  return st
}

/** The next unsigned 32-bit word. */
export function next32(st: RandomState): number {
  const a = st[0]
  const b = st[1]
  const c = st[2]
  const d = st[3]
  const t = (((a + b) | 0) + d) | 0
  st[3] = (d + 1) | 0
  st[0] = b ^ (b >>> 9)
  st[1] = (c + (c << 3)) | 0
  st[2] = (((c << 21) | (c >>> 11)) + t) | 0
  return t >>> 0
}

/** Uniform on [0, 1) with 32 random bits. */
export function nextUniform(st: RandomState): number {
  return next32(st) / 4294967296
}

/** Uniform on [0, 1) with 32 random bits, as a function. */
export function createRandom(seed: number): Random {
  return uniformOf(randomState(seed))
}

export function uniformOf(st: RandomState): Random {
  return () => nextUniform(st)
}

// Unit exponential draw; 1 − u lies in (0, 1] so the logarithm is always finite.
export function unitExponential(random: Random): number {
  return -Math.log(1 - random())
}

// Largest of m unit exponentials in one draw: its CDF is (1 − e^−x)^m, so x = −ln(1 − U^(1/m)).
export function maxOfUnitExponentials(random: Random, m: number): number {
  return largestOf(random(), m)
}

export function nextMaxExponential(st: RandomState, m: number): number {
  return largestOf(nextUniform(st), m)
}

const largestOf = (u: number, m: number) => -Math.log(-Math.expm1(Math.log(u) / m))

// Ziggurat tables for the unit exponential (G. Marsaglia and W. W. Tsang, "The Ziggurat Method for
// Generating Random Variables", J. Statistical Software 5(8), 2000: 256 layers, their constants). A
// draw splits one 32-bit word: the low 8 bits pick the layer, the high 24 bits the point in it, so
// the two are independent. About 99 % of draws need no logarithm or exponential.
const LAYERS = 256
const SCALE = 2 ** 24
const R = 7.697117470131487 // right edge of the base layer
const AREA = 3.949659822581572e-3 // area of each layer
const ke = new Uint32Array(LAYERS)
const we = new Float64Array(LAYERS)
const fe = new Float64Array(LAYERS)
{
  let de = R
  let te = R
  const q = AREA / Math.exp(-de)
  ke[0] = Math.floor((de / q) * SCALE)
  ke[1] = 0
  we[0] = q / SCALE
  we[LAYERS - 1] = de / SCALE
  fe[0] = 1
  fe[LAYERS - 1] = Math.exp(-de)
  for (let i = LAYERS - 2; i >= 1; i--) {
    de = -Math.log(AREA / de + Math.exp(-de))
    ke[i + 1] = Math.floor((de / te) * SCALE)
    te = de
    fe[i] = Math.exp(-de)
    we[i] = de / SCALE
  }
}

/** A unit exponential draw by the ziggurat method (exact, not an approximation). */
export function nextExponential(st: RandomState): number {
  const word = next32(st)
  const i = word & 255
  const j = word >>> 8
  return j < ke[i] ? j * we[i] : exponentialTail(st, word)
}

// The ~1 % of draws outside a layer's rectangle.
function exponentialTail(st: RandomState, word: number): number {
  for (;;) {
    const i = word & 255
    const j = word >>> 8
    if (j < ke[i]) return j * we[i]
    // The base layer's tail beyond R is exponential again (memorylessness).
    if (i === 0) return R - Math.log(1 - nextUniform(st))
    const x = j * we[i]
    if (fe[i] + nextUniform(st) * (fe[i - 1] - fe[i]) < Math.exp(-x)) return x
    word = next32(st)
  }
}
