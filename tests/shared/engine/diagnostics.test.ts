import { describe, expect, it } from 'vitest'
import {
  ISOLATION_CAUTION,
  coldResistance,
  filamentTemperature,
  resistanceRatio,
} from '../../../shared/engine'

describe('tungsten table (Forsythe & Worthing 1925 via CRC Handbook; trade-reference §4)', () => {
  it('maps hot/cold ratios to filament temperature', () => {
    // trade-reference §4: a ratio of 15 ≈ 2800 K, 10 ≈ 2000 K.
    expect(Math.abs(filamentTemperature(15) - 2800)).toBeLessThan(25)
    expect(Math.abs(filamentTemperature(10) - 2000)).toBeLessThan(25)
  })

  it('returns the tabulated resistivity ratios at table points', () => {
    // trade-reference §4: ρ(2000 K) = 56.67, ρ(300 K) = 5.65 µΩ·cm.
    expect(resistanceRatio(2000)).toBeCloseTo(56.67 / 5.65, 9)
    expect(resistanceRatio(300)).toBe(1)
    expect(filamentTemperature(resistanceRatio(1234))).toBeCloseTo(1234, 6)
  })
})

// trade-reference §2a (bench measurement, common practice): a 20-lamp mains series string (19 shunted
// + 1 fuse lamp) draws about 73 mA on 247 V and measures about 310 Ω cold.
const bench = {
  lamps: [
    { count: 19, ratedVolts: 12, ratedAmps: 0.07 },
    { count: 1, ratedVolts: 12, ratedAmps: 0.07, shunted: false },
  ],
}
const hotReading = { volts: 247, amps: 0.073 }

describe('cold resistance without a reference: the bench hot/cold ratio', () => {
  it('expects about 307 Ω for the bench string and calls its measured 310 Ω healthy', () => {
    // Hot: 247 / 0.073 = 3383.56 Ω (bench, §2a). Default ratio 11 (bench, §2a): 3383.56 / 11 = 307.60 Ω.
    // Tolerance on expected: ratio ±10 % + clamp 2 % + volts 1 % + string spread 3 % = ±16 %; ohmmeter ±1 %.
    // Open above 307.60 × 1.16 / 0.99 = 360.42 Ω; shorted below 307.60 × 0.84 / 1.01 = 255.82 Ω.
    const r = coldResistance({ ...bench, hotReading, measuredOhms: 310 })
    expect(r.basis).toBe('hot-reading')
    expect(r.hotOhms).toBeCloseTo(3383.56, 1)
    expect(r.hotColdRatio).toBe(11)
    expect(r.expectedOhms).toBeCloseTo(307.6, 1)
    expect(r.expectedTolerance).toBeCloseTo(0.16, 9)
    expect(r.thresholds.openAboveOhms).toBeCloseTo(360.42, 1)
    expect(r.thresholds.shortedBelowOhms).toBeCloseTo(255.82, 1)
    expect(r.finding).toBe('ok')
    expect(r.shortedEstimate).toBeNull()
  })

  it('still accepts an operating temperature: 2800 K gives the old ratio of about 15', () => {
    // Forsythe & Worthing (trade-reference §4): 84.70 / 5.65 = 14.991; 3383.56 / 14.991 = 225.70 Ω.
    const r = coldResistance({ ...bench, hotReading, operatingKelvin: 2800 })
    expect(r.hotColdRatio).toBeCloseTo(14.991, 3)
    expect(r.expectedOhms).toBeCloseTo(225.7, 1)
    expect(r.finding).toBe('not-measured')
  })

  it('takes a stated ratio: the bench fuse lamp, 106 Ω hot at 12 V and about 7 Ω cold', () => {
    // trade-reference §2a (bench measurement): one fuse lamp ≈ 7 Ω cold, ≈ 106 Ω at 12 V, ratio ≈ 15.
    // Hot reading 12 V / (12 / 106) A = 106 Ω; 106 / 15 = 7.067 Ω expected; 7 Ω is within the band.
    const lamp = { lamps: [{ count: 1, ratedVolts: 12, ratedAmps: 0.11, shunted: false }] }
    const r = coldResistance({
      ...lamp,
      hotReading: { volts: 12, amps: 12 / 106 },
      hotColdRatio: 15,
      measuredOhms: 7,
    })
    expect(r.expectedOhms).toBeCloseTo(7.067, 3)
    expect(r.finding).toBe('ok')
  })

  it('works from the lamp ratings with their ±10 % current tolerance', () => {
    // 20 × 12 V 0.25 A: hot 48 Ω each, 960 Ω (Ohm's law); 960 / 11 = 87.27 Ω.
    // Tolerance: ratio ±10 % + lamp current ±10 % (Lumitron "Lamp terminology") = ±20 %.
    const r = coldResistance({ lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25 }] })
    expect(r.basis).toBe('ratings')
    expect(r.hotOhms).toBeCloseTo(960, 9)
    expect(r.expectedOhms).toBeCloseTo(87.27, 2)
    expect(r.expectedTolerance).toBeCloseTo(0.2, 9)
    expect(r.message).toMatch(/87\.3 Ω expected/)
  })
})

describe('cold resistance against a reference of a healthy string', () => {
  const reference = { coldOhms: 310, lampsInCircuit: 20 } // bench, §2a

  it('derives the thresholds from the reference and the meter accuracy', () => {
    // E = 310 Ω; tolerance = meter 1 % + string spread 3 % = 4 %; meter 1 %.
    // Open above 310 × 1.04 / 0.99 = 325.66 Ω; shorted below 310 × 0.96 / 1.01 = 294.65 Ω;
    // dead short below half a lamp: 310 / 20 / 2 = 7.75 Ω.
    const r = coldResistance({ ...bench, reference })
    expect(r.basis).toBe('reference')
    expect(r.expectedOhms).toBe(310)
    expect(r.perLampOhms).toBeCloseTo(15.5, 9)
    expect(r.thresholds.openAboveOhms).toBeCloseTo(325.66, 2)
    expect(r.thresholds.shortedBelowOhms).toBeCloseTo(294.65, 2)
    expect(r.thresholds.deadShortBelowOhms).toBeCloseTo(7.75, 9)
  })

  it('counts shorted lamps with an honest range', () => {
    // 279 Ω: k = 20 (1 − 279/310) = 2.0; low = ⌈20 (1 − 279 × 1.01 / (310 × 0.96))⌉ = ⌈1.06⌉ = 2;
    // high = ⌊20 (1 − 279 × 0.99 / (310 × 1.04))⌋ = ⌊2.87⌋ = 2.
    const r = coldResistance({ ...bench, reference, measuredOhms: 279 })
    expect(r.finding).toBe('shorted')
    expect(r.shortedEstimate).toEqual({ estimate: 2, low: 2, high: 2 })
    // 248 Ω: k = 20 × 62/310 = 4.0; low ⌈20 (1 − 250.48/297.6)⌉ = ⌈3.17⌉ = 4; high ⌊20 (1 − 245.52/322.4)⌋ = ⌊4.77⌋ = 4.
    expect(coldResistance({ ...bench, reference, measuredOhms: 248 }).shortedEstimate).toEqual({
      estimate: 4,
      low: 4,
      high: 4,
    })
  })

  it('scales the reference to the lamps as built', () => {
    // Reference taken with 19 lamps in circuit: 310 / 19 = 16.316 Ω a lamp; 20 lamps: 326.32 Ω.
    const r = coldResistance({
      ...bench,
      reference: { coldOhms: 310, lampsInCircuit: 19 },
      measuredOhms: 326,
    })
    expect(r.expectedOhms).toBeCloseTo(326.32, 2)
    expect(r.finding).toBe('ok')
  })

  it('calls an open reading open, with the live-socket caution and the powered-string advice', () => {
    for (const measuredOhms of [null, 400]) {
      // 400 Ω > 325.66 Ω, the most an intact string of the type can read (above).
      const r = coldResistance({ ...bench, reference, measuredOhms })
      expect(r.finding).toBe('open')
      expect(r.caution).toBe(ISOLATION_CAUTION)
      expect(r.message).toMatch(/oxide/)
      expect(r.message).toMatch(/switch it on once, isolate it again and take the reading then/)
    }
  })

  it('says dead short plainly for a reading near 0 Ω', () => {
    // 2 Ω < 7.75 Ω (half a lamp's cold resistance, above).
    const r = coldResistance({ ...bench, reference, measuredOhms: 2 })
    expect(r).toMatchObject({ finding: 'shorted', deadShort: true, shortedEstimate: null })
    expect(r.message).toMatch(/^Dead short/)
  })
})

describe('cold resistance of two chains side by side', () => {
  // Two bench chains (310 Ω each, §2a bench measurement) in parallel: 155 Ω across the supply ends.
  // E = 155 Ω, a lamp p = 155 × 2 / 20 = 15.5 Ω; tolerance 1 % + 3 % = 4 %, meter 1 %.
  const two = { ...bench, branches: 2, reference: { coldOhms: 155, lampsInCircuit: 20 } }

  it('ranges the count between all shorts in one chain and shorts spread evenly', () => {
    // 140 Ω (below 155 × 0.96 / 1.01 = 147.33 Ω):
    // even: 40 × (1 − 140/155) = 3.871 → 4; high = ⌊40 × (1 − 138.6 / 161.2)⌋ = ⌊5.608⌋ = 5;
    // one chain: low = ⌈20 − 20 / (2 × 148.8 / 141.4 − 1)⌉ = ⌈20 − 20 / 1.104668⌉ = ⌈1.895⌉ = 2.
    const r = coldResistance({ ...two, measuredOhms: 140 })
    expect(r.expectedOhms).toBe(155)
    expect(r.perLampOhms).toBeCloseTo(15.5, 9)
    expect(r.shortedEstimate).toEqual({ estimate: 4, low: 2, high: 5 })
  })

  it('calls one chain open: 310 Ω is above 155 × 1.04 / 0.99 = 162.83 Ω', () => {
    const r = coldResistance({ ...two, measuredOhms: 310 })
    expect(r.thresholds.openAboveOhms).toBeCloseTo(162.83, 2)
    expect(r).toMatchObject({ finding: 'open', caution: ISOLATION_CAUTION })
    expect(r.message).toMatch(/one of its 2 chains open/)
  })
})

describe('cold resistance of a parallel string', () => {
  // 10 × 230 V 0.1 A in parallel: 2300 Ω hot each, 230 Ω together; / 11 = 20.91 Ω expected.
  // Shorted below 20.91 × 0.8 / 1.01 = 16.56 Ω; dead short below 20.91 / 2 = 10.45 Ω.
  const string = { lamps: [{ count: 10, ratedVolts: 230, ratedAmps: 0.1 }], wiring: 'parallel' as const }

  it('judges shorts between the conductors', () => {
    expect(coldResistance(string).expectedOhms).toBeCloseTo(20.91, 2)
    expect(coldResistance({ ...string, measuredOhms: 21 }).finding).toBe('ok')
    expect(coldResistance({ ...string, measuredOhms: 15 })).toMatchObject({
      finding: 'shorted',
      deadShort: false,
    })
    expect(coldResistance({ ...string, measuredOhms: 5 })).toMatchObject({
      finding: 'shorted',
      deadShort: true,
    })
  })
})
