import { describe, expect, it } from 'vitest'
import { burningHoursToDate, expectedTimeToKthFailure, forecast } from '../../../shared/engine'

// trade-reference §3 states the closed form with rate λ0 = 1/1000 h at rated voltage. Our forecast
// takes the *median* rated life; with Weibull shape 1 the median is ln 2 / λ0.
const LAMBDA0 = 1 / 1000
const fiftyAtRating = {
  supplyVolts: 125,
  lamps: [{ count: 50, ratedVolts: 2.5, ratedAmps: 0.17 }],
  ratedLifeHours: Math.LN2 / LAMBDA0,
  weibullShape: 1,
  shuntFailProbability: 0,
  trials: 20000,
}

describe('forecast against the closed form (shape 1, no shunt failures)', () => {
  // trade-reference §3: n = 50, λ0 = 1/1000 h: E[T_5] = 104.3 h (p = 0), 66.9 h (p = 12); the
  // published values are rounded to 0.1 h, hence the extra 0.05 h.
  for (const [p, published] of [
    [0, 104.3],
    [12, 66.9],
  ]) {
    it(`E[T_5] = ${published} h with life exponent ${p}, within three standard errors`, () => {
      const f = forecast({ ...fiftyAtRating, lifeExponent: p })
      const se = f.standardError[4]!
      expect(Math.abs(f.meanHoursToFailure[4]! - published)).toBeLessThanOrEqual(3 * se + 0.05)
      for (let k = 1; k <= 10; k++) {
        const exact = expectedTimeToKthFailure(50, LAMBDA0, p, k)
        expect(Math.abs(f.meanHoursToFailure[k - 1]! - exact)).toBeLessThanOrEqual(
          3 * f.standardError[k - 1]!,
        )
      }
      expect(f.pReached.every((x) => x === 1)).toBe(true)
    })
  }
})

describe('forecast: lifetimes and the cascade', () => {
  it('puts the median life of a lamp at rated voltage at its rated life', () => {
    // Rated life is the median (Lighting Research Center, NLPIP glossary).
    const f = forecast({
      supplyVolts: 12,
      lamps: [{ count: 1, ratedVolts: 12, ratedAmps: 0.5 }],
      ratedLifeHours: 1500,
      trials: 20000,
    })
    expect(Math.abs(f.medianHoursToDark! - 1500)).toBeLessThan(0.02 * 1500)
  })

  it('conditions on the age already on the lamps', () => {
    // Weibull conditional survival (ReliaWiki "The Weibull distribution"):
    // R(t | a) = exp(−((a + t)/η)^β + (a/η)^β), so the median remaining life is
    // η · ((a/η)^β + ln 2)^(1/β) − a, with η = L / (ln 2)^(1/β) for median L.
    const [L, beta, age] = [1000, 2.8, 800]
    const eta = L / Math.LN2 ** (1 / beta)
    const expected = eta * ((age / eta) ** beta + Math.LN2) ** (1 / beta) - age
    const f = forecast({
      supplyVolts: 12,
      lamps: [{ count: 1, ratedVolts: 12, ratedAmps: 0.5 }],
      ratedLifeHours: L,
      weibullShape: beta,
      lampAgeHours: age,
      trials: 20000,
    })
    expect(Math.abs(f.medianHoursToDark! - expected)).toBeLessThan(0.03 * expected)
  })

  it('leaves the survivors of a parallel string at the same stress', () => {
    const parallel = { ...fiftyAtRating, wiring: 'parallel' as const, supplyVolts: 2.5, trials: 500 }
    expect(forecast({ ...parallel, lifeExponent: 12 })).toEqual(forecast({ ...parallel, lifeExponent: 0 }))
  })

  it('puts a parallel string dark when its last lamp fails', () => {
    // Independent lamps: P(all m failed by t) = F(t)^m with Weibull F (ReliaWiki "The Weibull
    // distribution"), so the median time to dark solves F(t) = 0.5^(1/m).
    const [m, L, beta] = [40, 25000, 2.8]
    const eta = L / Math.LN2 ** (1 / beta)
    const expected = eta * (-Math.log(1 - 0.5 ** (1 / m))) ** (1 / beta)
    const f = forecast({
      supplyVolts: 24,
      wiring: 'parallel',
      lamps: [{ count: m, ratedVolts: 24, ratedAmps: 0.02, shunted: false }],
      ratedLifeHours: L,
      weibullShape: beta,
      trials: 20000,
    })
    expect(Math.abs(f.medianHoursToDark! - expected)).toBeLessThan(0.01 * expected)
    expect(f.pReached.every((x) => x === 1)).toBe(true)
  })

  it('goes dark at the first failure when every shunt opens', () => {
    const f = forecast({ ...fiftyAtRating, shuntFailProbability: 1, lifeExponent: 13, trials: 2000 })
    expect(f.meanHoursToDark).toBeCloseTo(f.meanHoursToFailure[0]!, 9)
    expect(f.pReached[1]).toBe(0)
  })

  it('goes dark sooner with a fuse lamp than without one', () => {
    // trade-reference §2: a fuse lamp fails open and puts the whole string out.
    const base = { supplyVolts: 240, ratedLifeHours: 1500, shuntFailProbability: 0, trials: 4000 }
    const plain = forecast({ ...base, lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25 }] })
    const fused = forecast({
      ...base,
      lamps: [
        { count: 19, ratedVolts: 12, ratedAmps: 0.25 },
        { count: 1, ratedVolts: 12, ratedAmps: 0.25, shunted: false },
      ],
    })
    expect(fused.medianHoursToDark!).toBeLessThan(plain.medianHoursToDark!)
    expect(fused.pDark[2].p).toBeGreaterThanOrEqual(plain.pDark[2].p)
  })

  it('reports a string that is already dark', () => {
    const f = forecast({
      supplyVolts: 240,
      lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25, failed: 1, shunted: false }],
      ratedLifeHours: 1500,
    })
    expect(f.meanHoursToFailure).toEqual([])
    expect(f.medianHoursToDark).toBe(0)
    expect(f.pDark.map((x) => x.p)).toEqual([1, 1, 1])
  })

  it('gives the same answer for the same seed and another for another seed', () => {
    const input = {
      supplyVolts: 120,
      lamps: [{ count: 50, ratedVolts: 2.5, ratedAmps: 0.17 }],
      ratedLifeHours: 1000,
    }
    expect(forecast({ ...input, seed: 7 })).toEqual(forecast({ ...input, seed: 7 }))
    expect(forecast({ ...input, seed: 7 }).meanHoursToFailure).not.toEqual(
      forecast({ ...input, seed: 8 }).meanHoursToFailure,
    )
  })

  it('has probabilities of dark that never fall with more burning hours', () => {
    const f = forecast({
      supplyVolts: 120,
      lamps: [{ count: 50, ratedVolts: 2.5, ratedAmps: 0.17, failed: 6 }],
      ratedLifeHours: 300,
    })
    expect(f.pDark.map((x) => x.hours)).toEqual([24, 72, 168])
    expect(f.pDark[0].p).toBeLessThanOrEqual(f.pDark[1].p)
    expect(f.pDark[1].p).toBeLessThanOrEqual(f.pDark[2].p)
  })
})

describe('burning hours to calendar dates', () => {
  it('counts nights of burning from the start date', () => {
    expect(burningHoursToDate(0, '2025-11-20', 7)).toBe('2025-11-20')
    expect(burningHoursToDate(7, '2025-11-20', 7)).toBe('2025-11-20')
    expect(burningHoursToDate(7.5, '2025-11-20', 7)).toBe('2025-11-21')
    expect(burningHoursToDate(6 * 7 + 1, '2025-12-30', 7)).toBe('2026-01-05')
    expect(burningHoursToDate(null, '2025-11-20', 7)).toBeNull()
  })

  it('dates the forecast when given a start date', () => {
    const f = forecast({
      supplyVolts: 240,
      lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25, failed: 2 }],
      ratedLifeHours: 1500,
      burnHoursPerDay: 6,
      startDate: '2025-11-28',
    })
    expect(f.dates!.failures[0]).toBe(burningHoursToDate(f.meanHoursToFailure[0], '2025-11-28', 6))
    expect(f.dates!.medianDark! >= '2025-11-28').toBe(true)
  })
})
