import { describe, expect, it } from 'vitest'
import { addExposure, expectedTimeToKthFailure, forecast } from '../../../shared/engine'
import { forecastRequestSchema } from '../../../shared/schemas/engine'

describe('addExposure (cumulative exposure, Nelson 1980)', () => {
  it('adds h × r^d rated-voltage hours per class', () => {
    // 100 h at r = 230/240 with d = 13: ln(23/24) = −0.0425596, × 13 = −0.553275,
    // e^−0.553275 = 0.575063 → 57.5063 h (bc -l).
    expect(addExposure([0], 100, [230 / 240], [13])[0]).toBeCloseTo(57.5063, 3)
    // Over rating the hours count for more: 10 h at r = 1.05, d = 13: 1.05^13 = 1.885649 → 18.8565 h.
    expect(addExposure([200], 10, [1.05], [13])[0]).toBeCloseTo(218.8565, 3)
  })

  it('leaves a class out of circuit alone and ages LED sections by plain hours', () => {
    // Ratio 0: not burning, nothing added; exponent 0 (LED): h × r^0 = h whatever the ratio.
    expect(addExposure([50, 50, 50], 24, [0, 1.2, 0.9], [13, 0, 0])).toEqual([50, 74, 74])
  })
})

describe('forecast: pDarkAt', () => {
  it('matches the closed form for one lamp of shape 1', () => {
    // One lamp, exponential life with median L: P(dark by t) = 1 − exp(−ln2 · t / L) = 1 − 2^(−t/L):
    // t = L/2 → 1 − 2^−0.5 = 0.292893; t = L → 0.5; t = 2L → 0.75.
    const f = forecast({
      supplyVolts: 12,
      lamps: [{ count: 1, ratedVolts: 12, ratedAmps: 0.5 }],
      ratedLifeHours: 1000,
      weibullShape: 1,
      trials: 20000,
      pDarkAt: [500, 1000, 2000],
    })
    expect(f.pDarkAt.map((x) => x.hours)).toEqual([500, 1000, 2000])
    ;[0.292893, 0.5, 0.75].forEach((p, i) => {
      expect(Math.abs(f.pDarkAt[i].p - p)).toBeLessThanOrEqual(3 * Math.sqrt((p * (1 - p)) / 20000))
    })
  })

  it('gives the same chances as pDark at the same hours, and none when not asked', () => {
    const input = {
      supplyVolts: 120,
      lamps: [{ count: 50, ratedVolts: 2.5, ratedAmps: 0.17, failed: 6 }],
      ratedLifeHours: 300,
    }
    const f = forecast({ ...input, pDarkAt: [168, 24, 72] })
    expect(f.pDarkAt).toEqual([f.pDark[2], f.pDark[0], f.pDark[1]])
    expect(forecast(input).pDarkAt).toEqual([])
  })

  it('is refused beyond eight hours or below zero', () => {
    const body = {
      supplyVolts: 12,
      lamps: [{ count: 1, ratedVolts: 12, ratedAmps: 0.5 }],
      ratedLifeHours: 1000,
    }
    expect(forecastRequestSchema.safeParse({ ...body, pDarkAt: [1, 2, 3, 4, 5, 6, 7, 8] }).success).toBe(true)
    expect(forecastRequestSchema.safeParse({ ...body, pDarkAt: [1, 2, 3, 4, 5, 6, 7, 8, 9] }).success).toBe(
      false,
    )
    expect(forecastRequestSchema.safeParse({ ...body, pDarkAt: [-1] }).success).toBe(false)
  })
})

describe('forecast: request checks', () => {
  const body = {
    supplyVolts: 240,
    branches: 2,
    lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25, failed: 30, opened: 5, removed: 5 }],
    ratedLifeHours: 1500,
  }
  it('counts failures over every chain', () => {
    // 20 lamps a chain × 2 chains = 40: 30 + 5 + 5 fit, one more does not.
    expect(forecastRequestSchema.safeParse(body).success).toBe(true)
    const over = { ...body, lamps: [{ ...body.lamps[0], removed: 6 }] }
    expect(forecastRequestSchema.safeParse(over).success).toBe(false)
  })
})

describe('forecast: the closed form through the general path', () => {
  // trade-reference §3: n = 50, λ0 = 1/1000 h: E[T_5] = 104.3 h (p = 0), 66.9 h (p = 12). The same
  // 50 lamps given as two classes of 25 go through the per-class path (several groups), which must
  // agree as well (published values rounded to 0.1 h, hence the extra 0.05 h).
  for (const [p, published] of [
    [0, 104.3],
    [12, 66.9],
  ]) {
    it(`E[T_5] = ${published} h with life exponent ${p}`, () => {
      const half = { count: 25, ratedVolts: 2.5, ratedAmps: 0.17 }
      const f = forecast({
        supplyVolts: 125,
        lamps: [half, { ...half }],
        ratedLifeHours: Math.LN2 * 1000,
        weibullShape: 1,
        lifeExponent: p,
        shuntFailProbability: 0,
        trials: 20000,
      })
      expect(Math.abs(f.meanHoursToFailure[4]! - published)).toBeLessThanOrEqual(
        3 * f.standardError[4]! + 0.05,
      )
      const exact = expectedTimeToKthFailure(50, 1 / 1000, p, 10)
      expect(Math.abs(f.meanHoursToFailure[9]! - exact)).toBeLessThanOrEqual(3 * f.standardError[9]!)
    })
  }
})
