import { describe, expect, it } from 'vitest'
import { coldResistance, estimateShorted, filamentTemperature, resistanceRatio } from '../../../shared/engine'

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

describe('cold resistance', () => {
  // 20 × 12 V, 0.25 A lamps: hot resistance 48 Ω each, 960 Ω for the string (Ohm's law).
  const string = { lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25 }] }

  it('is about 1/15 of the hot resistance at rated operating temperature', () => {
    // Wikipedia "Incandescent light bulb": cold ≈ 1/15 of hot resistance.
    const r = coldResistance(string)
    expect(r.hotOhms).toBeCloseTo(960, 9)
    expect(r.expectedOhms / 64).toBeCloseTo(1, 2)
    expect(r.finding).toBe('not-measured')
  })

  it('calls a reading far above expected, or open, an open joint or lamp', () => {
    expect(coldResistance({ ...string, measuredOhms: null }).finding).toBe('open')
    expect(coldResistance({ ...string, measuredOhms: 200 }).finding).toBe('open')
    expect(coldResistance({ ...string, measuredOhms: 200 }).message).toMatch(/isolate/)
  })

  it('counts shorted lamps from a reading below expected', () => {
    // Each shorted lamp takes one lamp's cold resistance (64/20 Ω) out of the series string.
    const r = coldResistance({ ...string, measuredOhms: (64 * 17) / 20 })
    expect(r).toMatchObject({ finding: 'shorted', shortedEstimate: 3 })
    expect(coldResistance({ ...string, measuredOhms: 64 }).finding).toBe('ok')
  })
})

describe('estimate shorted lamps from a clamp-meter reading', () => {
  // Current law I = I_rated · r^0.55 (Fink & Beaty via Wikipedia "Lamp rerating"); voltage share
  // V_supply / (N − k) (trade-reference §2, common practice).
  const reading = (n: number, k: number, supply: number, ratedV: number, ratedA: number) =>
    ratedA * (supply / (ratedV * (n - k))) ** 0.55

  it('finds 3 shorted in 20 × 12 V on 240 V', () => {
    const r = estimateShorted({
      supplyVolts: 240,
      measuredAmps: reading(20, 3, 240, 12, 0.25),
      lampCount: 20,
      ratedVolts: 12,
      ratedAmps: 0.25,
    })
    expect(r.estimate).toBe(3)
    expect(r.low).toBeLessThan(3)
    expect(r.high).toBeGreaterThan(3)
  })

  it('finds 5 shorted in 50 × 2.5 V on 120 V and none in a full string', () => {
    const base = { supplyVolts: 120, lampCount: 50, ratedVolts: 2.5, ratedAmps: 0.17 }
    expect(estimateShorted({ ...base, measuredAmps: reading(50, 5, 120, 2.5, 0.17) }).estimate).toBe(5)
    const none = estimateShorted({ ...base, measuredAmps: reading(50, 0, 120, 2.5, 0.17) })
    expect(none.estimate).toBe(0)
    expect(none.low).toBe(0)
  })

  it('widens the range with a less accurate meter', () => {
    const base = {
      supplyVolts: 240,
      measuredAmps: reading(20, 3, 240, 12, 0.25),
      lampCount: 20,
      ratedVolts: 12,
      ratedAmps: 0.25,
    }
    const tight = estimateShorted({ ...base, currentTolerance: 0, voltsTolerance: 0 })
    const loose = estimateShorted({ ...base, currentTolerance: 0.05, voltsTolerance: 0.02 })
    expect([tight.low, tight.high]).toEqual([3, 3])
    expect(loose.high - loose.low).toBeGreaterThan(2)
  })
})
