import type { ColdResistanceRequest, ColdResistanceResponse, LampClassInput } from '../schemas/engine'
import * as D from './defaults'
import { ISOLATION_CAUTION } from './reason-codes'
import { resistanceRatio } from './tungsten'

type Basis = ColdResistanceResponse['basis']

interface Expected {
  basis: Basis
  hotOhms: number | null
  hotColdRatio: number | null
  /** cold ohms of the string as built */
  ohms: number
  /** ± share of `ohms` a healthy string of the type may differ by, before today's meter error */
  tolerance: number
}

const lampOhms = (c: LampClassInput) => c.ratedVolts / c.ratedAmps

/** How lamps combine: `n` lamps a chain, `m` chains side by side, in series chains or all in parallel. */
interface Layout {
  n: number
  m: number
  series: boolean
}
/** A whole string's ohms from one lamp's. */
const stringOf = (each: number, { n, m, series }: Layout) => (series ? (each * n) / m : each / (n * m))
/** One lamp's ohms from a whole string's reading with `lamps` lamps a chain. */
const lampOf = (ohms: number, lamps: number, { m, series }: Layout) =>
  series ? (ohms * m) / lamps : ohms * lamps * m

function ratioOf(input: ColdResistanceRequest): number {
  if (input.hotColdRatio !== undefined) return input.hotColdRatio
  if (input.operatingKelvin !== undefined) return resistanceRatio(input.operatingKelvin)
  return D.DEFAULT_HOT_COLD_RATIO
}

// Where the expected value comes from, best first, and how far a healthy string may differ from it:
// - a healthy string's cold reading (scaled to the lamps as built): that meter's error plus the
//   spread between strings of one type;
// - a healthy string's hot reading ÷ the hot/cold ratio: the ratio's tolerance, the clamp meter's and
//   voltmeter's errors (DEFAULT_CURRENT_TOLERANCE, DEFAULT_VOLTS_TOLERANCE) and the spread;
// - the lamps' ratings (hot = V_rated / I_rated) ÷ the ratio: the ratio's tolerance and the lamps'
//   current tolerance (Lumitron "Lamp terminology": ±10 %).
function expected(input: ColdResistanceRequest, layout: Layout): Expected {
  const a = input.meterAccuracy ?? D.DEFAULT_OHMMETER_ACCURACY
  const spread = input.stringSpread ?? D.DEFAULT_STRING_SPREAD
  const ratioTol = input.hotColdRatioTolerance ?? D.DEFAULT_HOT_COLD_RATIO_TOLERANCE
  if (input.reference) {
    const { coldOhms, lampsInCircuit } = input.reference
    const ohms = stringOf(lampOf(coldOhms, lampsInCircuit, layout), layout)
    return { basis: 'reference', hotOhms: null, hotColdRatio: null, ohms, tolerance: a + spread }
  }
  const ratio = ratioOf(input)
  if (input.hotReading) {
    const { volts, amps, lampsInCircuit = layout.n } = input.hotReading
    const hotOhms = stringOf(lampOf(volts / amps, lampsInCircuit, layout), layout)
    const meter = D.DEFAULT_CURRENT_TOLERANCE + D.DEFAULT_VOLTS_TOLERANCE
    const tolerance = ratioTol + meter + spread
    return { basis: 'hot-reading', hotOhms, hotColdRatio: ratio, ohms: hotOhms / ratio, tolerance }
  }
  const { m, series } = layout
  const hotOhms = series
    ? input.lamps.reduce((s, c) => s + c.count * lampOhms(c), 0) / m
    : 1 / (m * input.lamps.reduce((s, c) => s + c.count / lampOhms(c), 0))
  const tolerance = ratioTol + (input.lampCurrentTolerance ?? D.DEFAULT_LAMP_CURRENT_TOLERANCE)
  return { basis: 'ratings', hotOhms, hotColdRatio: ratio, ohms: hotOhms / ratio, tolerance }
}

export const ohmsText = (x: number) => `${x >= 100 ? Math.round(x) : x >= 10 ? x.toFixed(1) : x.toFixed(2)} Ω`
const pct = (x: number) => `${Math.round(x * 1000) / 10} %`
const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x))

const OXIDE =
  'An ohmmeter can read far too high until the oxide on a lamp contact breaks down: if the string ' +
  'was not powered since it was hung, switch it on once, isolate it again and take the reading then.'

// Expected cold (switched-off) resistance of a string with every lamp intact, the thresholds a reading
// is judged against, and what a reading R says. A reading can only be trusted to ± the meter's
// accuracy a, and the expected value E to ± u (see `expected`), so:
//   open above    E (1 + u) / (1 − a): higher than any intact string of the type can read;
//   shorted below E (1 − u) / (1 + a): lower than any intact string can read: something is shorted;
//   dead short below half of one lamp's cold resistance (series) or half of E (parallel).
// Series, m chains of N lamps, each shorted lamp taking its cold resistance p = m E / N out of its
// chain. The count depends on where the shorts are (m = 1: both are k = N (1 − R / E)):
//   spread evenly (most lamps):   R = E (1 − k / (m N))            ⇒ k = m N (1 − R / E);
//   all in one chain (fewest):    1/R = (m − 1)/(N p) + 1/((N − k) p) ⇒ k = N − N / (m E / R − (m − 1)).
// low = ⌈k_one with R (1 + a), E (1 − u)⌉, high = ⌊k_even with R (1 − a), E (1 + u)⌋.
const kEven = (r: number, e: number, { n, m }: Layout) => m * n * (1 - r / e)
function kOne(r: number, e: number, { n, m }: Layout): number {
  const d = (m * e) / r - (m - 1)
  return d <= 0 ? -Infinity : n - n / d
}

export function coldResistance(input: ColdResistanceRequest): ColdResistanceResponse {
  const series = (input.wiring ?? 'series') === 'series'
  const n = input.lamps.reduce((s, c) => s + c.count, 0)
  const layout: Layout = { n, m: input.branches ?? 1, series }
  const total = n * layout.m
  const a = input.meterAccuracy ?? D.DEFAULT_OHMMETER_ACCURACY
  const e = expected(input, layout)
  const u = Math.min(e.tolerance, 0.9)
  const E = e.ohms
  const perLampOhms = lampOf(E, n, layout)
  const thresholds = {
    openAboveOhms: (E * (1 + u)) / (1 - a),
    shortedBelowOhms: (E * (1 - u)) / (1 + a),
    deadShortBelowOhms: series ? perLampOhms / 2 : E / 2,
  }
  const base = {
    basis: e.basis,
    hotOhms: e.hotOhms,
    expectedOhms: E,
    hotColdRatio: e.hotColdRatio,
    perLampOhms,
    expectedTolerance: u,
    thresholds,
    deadShort: false,
    shortedEstimate: null,
    caution: null,
  }
  const healthy =
    `a healthy string of this type reads ${ohmsText(thresholds.shortedBelowOhms)} to ` +
    ohmsText(thresholds.openAboveOhms)
  const r = input.measuredOhms
  if (r === undefined) {
    return {
      ...base,
      finding: 'not-measured',
      message: `${ohmsText(E)} expected with every lamp intact: ${healthy}.`,
    }
  }
  if (r === null || r > thresholds.openAboveOhms) {
    const reading =
      r === null
        ? 'Reads open circuit'
        : `Reads ${ohmsText(r)}, more than the ${ohmsText(thresholds.openAboveOhms)} an intact string of this type can read`
    const chain = layout.m > 1 ? `one of its ${layout.m} chains open: ` : ''
    return {
      ...base,
      finding: 'open',
      caution: ISOLATION_CAUTION,
      message:
        `${reading}: ${chain}a lamp failed open or missing from its socket, or an open or ` +
        `high-resistance joint. ${OXIDE}`,
    }
  }
  const against = `Reads ${ohmsText(r)} against ${ohmsText(E)} expected (${healthy})`
  if (r < thresholds.deadShortBelowOhms) {
    return {
      ...base,
      finding: 'shorted',
      deadShort: true,
      message:
        `Dead short: reads ${ohmsText(r)}, close to nothing. The conductors are shorted together (a ` +
        'crushed or cut cable, water in a joint), not just lamps. Do not switch it on until the short is found.',
    }
  }
  if (!series) {
    const finding = r < thresholds.shortedBelowOhms ? 'shorted' : 'ok'
    const what = finding === 'ok' ? 'no fault seen.' : 'look for a short between the conductors.'
    return { ...base, finding, message: `${against}: ${what}` }
  }
  const maxK = total
  let low = clamp(Math.ceil(kOne(r * (1 + a), E * (1 - u), layout) - 1e-9), 0, maxK)
  let high = clamp(Math.floor(kEven(r * (1 - a), E * (1 + u), layout) + 1e-9), 0, maxK)
  if (low > high) [low, high] = [high, low]
  const estimate = clamp(Math.round(kEven(r, E, layout)), low, high)
  const where = layout.m > 1 ? ', fewest if all in one chain, most if spread evenly' : ''
  const allowing = `allowing ±${pct(a)} on the meter and ±${pct(u)} on the expected value${where}`
  if (r >= thresholds.shortedBelowOhms) {
    const hidden =
      high < 1
        ? ''
        : ` Up to ${high} shorted ${high === 1 ? 'lamp' : 'lamps'} would not show at this accuracy` +
          (e.basis === 'reference'
            ? '.'
            : ': enter a healthy string of this type as the reference to narrow it.')
    return { ...base, finding: 'ok', message: `${against}: no fault seen.${hidden}` }
  }
  return {
    ...base,
    finding: 'shorted',
    shortedEstimate: { estimate, low, high },
    message: `${against}: about ${estimate} of ${total} lamps shorted (${low} to ${high}, ${allowing}).`,
  }
}
