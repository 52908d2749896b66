import { describe, expect, it } from 'vitest'
import { ISOLATION_CAUTION, estimateShorted } from '../../../shared/engine'

// Current law I = I_rated · r^0.55 (Fink & Beaty via Wikipedia "Lamp rerating"); voltage share
// V_supply / (N − k) (trade-reference §2, common practice). Inverted by hand:
//   k(I) = N − V / (V_rated · (I / I_rated)^(1/0.55)),  1/0.55 = 1.818182.
// Only the meter error asked for in each case: the rest set to 0 unless the test says otherwise.
const exact = { voltsTolerance: 0, lampCurrentTolerance: 0 }

describe('estimate shorted lamps from a clamp-meter reading', () => {
  it('finds 3 shorted in 20 × 12 V on 240 V with a fine meter (one digit 0.1 mA)', () => {
    // trade-reference §2: 3 shorted → 240/17 = 14.118 V a lamp; I = 0.25 × (14.118/12)^0.55:
    // ln 1.176471 = 0.162519, × 0.55 = 0.089385, exp = 1.093502, I = 0.273376 A. Neighbours: 2 shorted
    // → 0.25 × (240/(12 × 18))^0.55 = 0.25 × exp(0.55 × 0.105361) = 0.264915 A; 4 → 0.25 × exp(0.55 × 0.223144)
    // = 0.282644 A: both far outside 0.273376 ± 0.0001 A.
    const r = estimateShorted({
      supplyVolts: 240,
      measuredAmps: 0.273376,
      lampCount: 20,
      ratedVolts: 12,
      ratedAmps: 0.25,
      ...exact,
      meterAccuracy: 0,
      meterResolutionAmps: 0.0001,
    })
    expect(r).toMatchObject({ estimate: 3, low: 3, high: 3, finding: 'shorted', caution: null })
  })

  it('widens to ±3 lamps with one digit of 0.01 A and ±2 %: 35 × 3.5 V 0.2 A on 120 V', () => {
    // Ratings of a 35-light mini set (memory). Reading 0.22 A, band ± (0.02 × 0.22 + 0.01) = ±0.0144 A.
    // k(0.22):   (1.1)^1.818182 = exp(0.0953102 × 1.818182) = 1.189207; 120 / (3.5 × 1.189207) = 28.831;
    //            k = 6.169 → 6.
    // k(0.2056): (1.028)^1.818182 = exp(0.0502095) = 1.051491; 120 / 3.680219 = 32.607; k = 2.393 → ⌈⌉ 3.
    // k(0.2344): (1.172)^1.818182 = exp(0.288568) = 1.334530; 120 / 4.670855 = 25.691; k = 9.309 → ⌊⌋ 9.
    // One more shorted lamp near 6: 0.2 × (120/(3.5 × 28))^0.55 − 0.2 × (120/(3.5 × 29))^0.55
    //   = 0.223566 − 0.219292 = 0.004273 A.
    const r = estimateShorted({
      supplyVolts: 120,
      measuredAmps: 0.22,
      lampCount: 35,
      ratedVolts: 3.5,
      ratedAmps: 0.2,
      ...exact,
      meterAccuracy: 0.02,
      meterResolutionAmps: 0.01,
    })
    expect(r).toMatchObject({ estimate: 6, low: 3, high: 9 })
    expect(r.readingBand.lowAmps).toBeCloseTo(0.2056, 9)
    expect(r.readingBand.highAmps).toBeCloseTo(0.2344, 9)
    expect(r.ampsPerShortedLamp).toBeCloseTo(0.004273, 5)
    expect(r.explanation).toMatch(/3 to 9/)
  })

  // Festoon of the catalogue (shared/lamp-catalogue.ts FES-F30, ratings common practice): 30 × 8 V 0.3 A
  // on 230 V, read 0.32 A.
  const festoon = { supplyVolts: 230, measuredAmps: 0.32, lampCount: 30, ratedVolts: 8, ratedAmps: 0.3 }

  it('festoon: ±2 % and one digit alone give 2 to 6', () => {
    // Band 0.32 ± (0.0064 + 0.01) = 0.3036 to 0.3364 A.
    // k(0.32):   (1.066667)^1.818182 = exp(0.117343) = 1.124504; 230 / 8.99603 = 25.567; k = 4.433 → 4.
    // k(0.3036): (1.012)^1.818182 = exp(0.0216883) = 1.021925; 230 / 8.17540 = 28.133; k = 1.867 → 2.
    // k(0.3364): (1.121333)^1.818182 = exp(0.208215) = 1.231477; 230 / 9.85182 = 23.346; k = 6.654 → 6.
    const r = estimateShorted({ ...festoon, ...exact, meterAccuracy: 0.02, meterResolutionAmps: 0.01 })
    expect(r).toMatchObject({ estimate: 4, low: 2, high: 6, finding: 'shorted' })
  })

  it("festoon with the defaults: ±1 % volts and the lamps' ±10 % widen it to 0 to 10", () => {
    // Defaults: meter ±2 % + 0.01 A, volts ±1 %, lamp current ±10 % (Lumitron "Lamp terminology").
    // low:  most current per lamp, V = 232.3, f = 1.1: (0.3036 / 0.33)^1.818182 = exp(−0.151603)
    //       = 0.859330; 232.3 / 6.87464 = 33.791; k = −3.791 → 0.
    // high: least current per lamp, V = 227.7, f = 0.9: (0.3364 / 0.27)^1.818182 = exp(0.399800)
    //       = 1.491527; 227.7 / 11.93222 = 19.083; k = 10.917 → 10.
    const r = estimateShorted(festoon)
    expect(r).toMatchObject({ estimate: 4, low: 0, high: 10 })
    expect(r.explanation).toMatch(/±10 % on the lamps' current/)
  })

  it('uses a healthy string as the reference instead of the rating', () => {
    // Bench (trade-reference §2a, bench measurement): 20 lamps, 73 mA at 247 V → 12.35 V a lamp.
    // Another string of the type reads 0.080 A at 247 V on a meter of ±2 % and 0.001 A.
    // Reference error: 2 % + 0.001/0.073 + 0.55 × 0 (volts exact) + 3 % spread = 0.063699.
    // k(0.080):  (0.08/0.073)^1.818182 = exp(0.166486) = 1.181143; 247 / 14.58712 = 16.933; k = 3.067 → 3.
    // low:  0.0774 / (1.063699 × 0.073) = 0.996781; ^1.818182 = 0.994155; 247 / 12.27781 = 20.118; k < 0 → 0.
    // high: 0.0826 / (0.936301 × 0.073) = 1.208486; ^1.818182 = 1.410953; 247 / 17.42527 = 14.175; k = 5.825 → 5.
    const r = estimateShorted({
      supplyVolts: 247,
      measuredAmps: 0.08,
      lampCount: 20,
      ratedVolts: 12,
      ratedAmps: 0.07,
      meterAccuracy: 0.02,
      meterResolutionAmps: 0.001,
      voltsTolerance: 0,
      reference: { volts: 247, amps: 0.073, lampsInCircuit: 20 },
    })
    expect(r).toMatchObject({ estimate: 3, low: 0, high: 5 })
    expect(r.explanation).toMatch(/the reference reading/)
  })

  it('two chains side by side: fewest if the shorts are in one chain, most if spread evenly', () => {
    // 2 chains of 20 × 12 V 0.25 A on 240 V; fine meter (one digit 0.1 mA), reading 0.600 A.
    // c = 0.25 × 20^0.55 = 0.25 × exp(0.55 × 2.995732) = 1.298693 A; 20^−0.55 = 0.192501.
    // One chain: x = 0.5999 / 1.298693 − 0.192501 = 0.269425; 20 − x^−1.818182 = 20 − exp(2.384484)
    //   = 20 − 10.853 = 9.147 → ⌈⌉ 10.
    // Spread evenly: 0.6 / (2 × 1.298693) = 0.231001; 2 × (20 − 0.231001^−1.818182) = 2 × (20 − 14.357)
    //   = 11.286 → 11; at 0.6001 A: 11.295 → ⌊⌋ 11.
    const r = estimateShorted({
      ...catenary,
      branches: 2,
      measuredAmps: 0.6,
      ...exact,
      meterAccuracy: 0,
      meterResolutionAmps: 0.0001,
    })
    expect(r).toMatchObject({ estimate: 11, low: 10, high: 11, finding: 'shorted' })
    expect(r.explanation).toMatch(/2 chains of 20/)
  })

  const catenary = { lampCount: 20, ratedVolts: 12, ratedAmps: 0.25, supplyVolts: 240 }

  it('says dead short plainly, with the isolation caution', () => {
    // One lamp left across 240 V at most: 1.1 × 0.25 × (242.4 / 12)^0.55 = 0.275 × exp(0.55 × 3.005683)
    // = 0.275 × 5.2232 = 1.436 A; the reading 5 A (band from 4.89 A) is far above.
    const r = estimateShorted({ ...catenary, measuredAmps: 5 })
    expect(r.finding).toBe('dead-short')
    expect(r.explanation).toMatch(/^Dead short/)
    expect(r.caution).toBe(ISOLATION_CAUTION)
  })

  it('sends a reading below a full string to the supply and the joints', () => {
    // Full string, least: 0.9 × 0.25 × (237.6 / 240)^0.55 = 0.225 × 0.994488 = 0.2238 A; 0.1 A reads at
    // most 0.1 × 1.02 + 0.01 = 0.112 A.
    const r = estimateShorted({ ...catenary, measuredAmps: 0.1 })
    expect(r).toMatchObject({ finding: 'low-current', estimate: 0, low: 0, high: 0 })
    expect(r.explanation).toMatch(/high-resistance joint/)
  })

  it('still takes the older currentTolerance when meterAccuracy is not given', () => {
    const base = { ...festoon, ...exact, meterResolutionAmps: 0.01 }
    expect(estimateShorted({ ...base, currentTolerance: 0.02 })).toMatchObject({ low: 2, high: 6 })
  })
})
