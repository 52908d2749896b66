import type { EstimateShortedRequest, EstimateShortedResponse } from '../schemas/engine'
import * as D from './defaults'
import { CURRENT_EXPONENT as P } from './lamp-laws'
import { ISOLATION_CAUTION } from './reason-codes'

const pct = (x: number) => `${Math.round(x * 1000) / 10} %`
const ampsText = (x: number) => `${x < 1 ? x.toFixed(3) : x.toFixed(2)} A`
const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x))

// Shorted lamps from a clamp-meter reading on a series string: m chains (branches) of N equal lamps
// side by side. With j shorted in a chain, one current flows through its N − j left (Fink & Beaty via
// Wikipedia "Lamp rerating"; share of trade-reference §2):
//   I_chain = f · c · (N − j)^−0.55,   c = I_0 · (V / V_0)^0.55,
// I_0, V_0 the lamp's rated amps and volts, or a healthy string's reference reading (amps per chain,
// volts per lamp). One chain (m = 1), k shorted: k(I) = N − (I / (f c))^(−1/0.55), the same as
// N − V / (V_0 (I / (f I_0))^(1/0.55)). With m > 1 the count depends on where the shorts are:
//   all in one chain (fewest lamps for a current): I = f c ((m − 1) N^−0.55 + (N − k)^−0.55);
//   spread evenly (most lamps):                    I = m f c (N − k/m)^−0.55.
// The reading is good to ± (accuracy × reading + one digit); the supply volts to ± vt; f = 1 ± the
// lamps' tolerance lt (or, with a reference, that reading's own error). Every k whose current can
// meet the reading's band is in the range:
//   low  = ⌈k_one(I_lo, V (1 + vt), 1 + lt)⌉,  high = ⌊k_even(I_hi, V (1 − vt), 1 − lt)⌋.
export function estimateShorted(input: EstimateShortedRequest): EstimateShortedResponse {
  const { supplyVolts: v, measuredAmps: i, lampCount: n } = input
  const m = input.branches ?? 1
  const acc = input.meterAccuracy ?? input.currentTolerance ?? D.DEFAULT_CURRENT_TOLERANCE
  const res = input.meterResolutionAmps ?? D.DEFAULT_METER_RESOLUTION_AMPS
  const vt = input.voltsTolerance ?? D.DEFAULT_VOLTS_TOLERANCE
  const ref = input.reference
  const v0 = ref ? ref.volts / (ref.lampsInCircuit ?? n) : input.ratedVolts
  const i0 = ref ? ref.amps / m : input.ratedAmps
  // A reference reading carries the meter's error, its volts' error (through the 0.55 power) and the
  // spread between strings of one type, in place of the lamps' rated tolerance.
  const lt = ref
    ? acc + res / ref.amps + P * vt + (input.stringSpread ?? D.DEFAULT_STRING_SPREAD)
    : (input.lampCurrentTolerance ?? D.DEFAULT_LAMP_CURRENT_TOLERANCE)
  const c = (volts: number, f: number) => f * i0 * (volts / v0) ** P
  const kOne = (amps: number, volts: number, f: number) => {
    const x = amps / c(volts, f) - (m - 1) * n ** -P
    return x <= 0 ? -Infinity : n - x ** (-1 / P)
  }
  const kEven = (amps: number, volts: number, f: number) =>
    amps <= 0 ? -Infinity : m * (n - (amps / (m * c(volts, f))) ** (-1 / P))
  const even = (k: number) => m * c(v, 1) * (n - k / m) ** -P
  const total = m * n
  const maxK = m * (n - 1)

  const band = { lowAmps: Math.max(0, i - acc * i - res), highAmps: i + acc * i + res }
  const reading = `${ampsText(i)} at ${v} V`
  const chains = m > 1 ? ` in ${m} chains of ${n}` : ''
  const step = (k: number) => (k + 1 <= maxK ? even(k + 1) - even(k) : even(k) - even(k - 1))
  const most = m * c(v * (1 + vt), 1 + lt) // every chain down to one lamp
  const least = m * c(v * (1 - vt), 1 - lt) * n ** -P // a full string

  if (band.lowAmps > most) {
    return {
      estimate: total,
      low: total,
      high: total,
      finding: 'dead-short',
      readingBand: band,
      ampsPerShortedLamp: step(maxK),
      explanation:
        `Dead short: ${reading} is more than this string can draw even with one lamp left in circuit ` +
        `(${ampsText(most)} at most). The conductors are shorted together, or something else is on the ` +
        'cable. Isolate it and find the short before switching on again.',
      caution: ISOLATION_CAUTION,
    }
  }
  if (band.highAmps < least) {
    return {
      estimate: 0,
      low: 0,
      high: 0,
      finding: 'low-current',
      readingBand: band,
      ampsPerShortedLamp: step(0),
      explanation:
        `${reading} is less than a full string of ${total} lamps${chains} draws (${ampsText(least)} at ` +
        'least): check the supply voltage, the lamp rating and for a high-resistance joint.',
      caution: null,
    }
  }
  let low = clamp(Math.ceil(kOne(band.lowAmps, v * (1 + vt), 1 + lt) - 1e-9), 0, maxK)
  let high = clamp(Math.floor(kEven(band.highAmps, v * (1 - vt), 1 - lt) + 1e-9), 0, maxK)
  if (low > high) [low, high] = [high, low]
  const estimate = clamp(Math.round(kEven(i, v, 1)), low, high)
  const perLamp = step(estimate)
  const where = m > 1 ? ' (fewest if the shorts are all in one chain, most if spread evenly)' : ''
  const explanation =
    `${reading} fits about ${estimate} shorted of ${total} lamps${chains}: ${low} to ${high}${where}, ` +
    `allowing the meter ±${pct(acc)} and one digit of ${res} A (so ${ampsText(band.lowAmps)} to ` +
    `${ampsText(band.highAmps)}), ±${pct(vt)} on the volts and ±${pct(lt)} on ` +
    `${ref ? 'the reference reading' : "the lamps' current"}. One more shorted lamp adds about ` +
    `${(perLamp * 1000).toFixed(1)} mA.`
  return {
    estimate,
    low,
    high,
    finding: estimate >= 1 ? 'shorted' : 'ok',
    readingBand: band,
    ampsPerShortedLamp: perLamp,
    explanation,
    caution: null,
  }
}
