import { describe, expect, it } from 'vitest'
import { FUSE_LAMP_LIFE_EXPONENT, forecast } from '../../../shared/engine'

const TRIALS = 20000
// Binomial standard error of a share p estimated from n trials.
const se = (p: number, n = TRIALS) => Math.sqrt((p * (1 - p)) / n)

describe('forecast: mixed rated currents and per-class life (shape 1, closed form)', () => {
  // Shape 1 (exponential lifetimes): each lamp of class c fails at rate λ_c · r_c^d_c, so the next
  // failure is of class c with probability n_c · λ_c · r_c^d_c / Σ (Rényi; trade-reference §3).
  it('solves each class its own ratio and re-solves it after each failure', () => {
    // 5 × 12 V 0.25 A + one 12 V 0.17 A lamp (no shunt, a wrong replacement) on 72 V; class d: 2 and
    // 4; λ equal. Hand calculation (series solve, k = 1/0.55; 6 figures, worked with bc -l):
    //   w_o = 0.25^k = 0.0804166, w_x = 0.17^k = 0.0398856
    //   S0 = 5·12/w_o + 12/w_x = 1046.98 → r_o = 72/(S0·w_o) = 0.855166, r_x = 72/(S0·w_x) = 1.72417
    //   q0 = r_x^4 / (r_x^4 + 5·r_o^2) = 8.83729 / (8.83729 + 3.65655) = 0.707332
    //   one 0.25 A lamp shorted: S1 = S0 − 12/w_o = 897.752 → r_o = 0.997311, r_x = 2.01076
    //   q1 = r_x^4 / (r_x^4 + 4·r_o^2) = 16.3470 / (16.3470 + 3.97851) = 0.804260
    // The 0.17 A lamp has no shunt, so the string goes dark when it fails: a second failure happens
    // with probability 1 − q0 = 0.292668, a third with (1 − q0)(1 − q1) = 0.0572867.
    const f = forecast({
      supplyVolts: 72,
      lamps: [
        { count: 5, ratedVolts: 12, ratedAmps: 0.25 },
        { count: 1, ratedVolts: 12, ratedAmps: 0.17, shunted: false, lifeExponent: 4 },
      ],
      ratedLifeHours: 1000,
      weibullShape: 1,
      lifeExponent: 2,
      shuntFailProbability: 0,
      trials: TRIALS,
    })
    expect(Math.abs(f.pReached[1] - 0.292668)).toBeLessThanOrEqual(3 * se(0.292668))
    expect(Math.abs(f.pReached[2] - 0.0572867)).toBeLessThanOrEqual(3 * se(0.0572867))
    // Kept at S0 the third failure's share would be 0.292668 · (1 − 8.83729 / (8.83729 + 4·0.855166²))
    // = 0.0727839, over nine standard errors away.
    expect(Math.abs(f.pReached[2] - 0.0727839)).toBeGreaterThan(5 * se(0.0572867))
  })

  it('puts the first failure on the fuse lamp as often as its rate says', () => {
    // 19 × 12 V + one 11 V fuse lamp, all 0.5 A, on 250 V: one current, so one ratio for every lamp
    // (trade-reference §2): r = 250 / (19·12 + 11) = 250/239 = 1.046025, r³ = 1.144528.
    // Fuse lamp: rated life 500 h, d = 16; the others 1000 h, d = 13. With every shunt opening the
    // string goes dark at its first failure, so the dark share of the fuse lamp is
    //   (1 · ln2/500 · r^16) / (1 · ln2/500 · r^16 + 19 · ln2/1000 · r^13) = 2r³ / (2r³ + 19) = 0.107523
    const f = forecast({
      supplyVolts: 250,
      lamps: [
        { count: 19, ratedVolts: 12, ratedAmps: 0.5 },
        { count: 1, ratedVolts: 11, ratedAmps: 0.5, shunted: false, lifeExponent: 16, ratedLifeHours: 500 },
      ],
      ratedLifeHours: 1000,
      weibullShape: 1,
      lifeExponent: 13,
      shuntFailProbability: 1,
      trials: TRIALS,
    })
    expect(Math.abs(f.darkByClass[1] - 0.107523)).toBeLessThanOrEqual(3 * se(0.107523))
    expect(f.darkByClass[0] + f.darkByClass[1]).toBeCloseTo(1, 9)
  })
})

describe('forecast: the fuse lamp is what puts the string out', () => {
  // trade-reference §2a: the fuse lamp is rated a little lower in voltage at the same current and
  // has no shunt. Common practice: 11 V beside 12 V lamps. Default shape, 2 % of shunts open.
  const catenary = (fuseExponent?: number) =>
    forecast({
      supplyVolts: 240,
      lamps: [
        { count: 19, ratedVolts: 12, ratedAmps: 0.5 },
        { count: 1, ratedVolts: 11, ratedAmps: 0.5, shunted: false, lifeExponent: fuseExponent },
      ],
      ratedLifeHours: 1500,
      shuntFailProbability: 0.02,
      trials: TRIALS,
    })

  it('with the same life law as the rest: the fuse lamp in 83 % of trials', () => {
    // Hand reasoning: at one current every lamp has the same ratio, so with the same life law the
    // 20 lamps are exchangeable and the fuse lamp's place in the failure order is uniform on 1..20.
    // K = lamps failed before it is uniform on 0..19; the string stays lit through them unless a
    // shunt opens (2 % each), so P(fuse lamp is the cause) = (1/20) Σ_{k=0}^{19} 0.98^k
    //   = (1 − 0.98^20) / (20 · 0.02) = (1 − 0.667608) / 0.4 = 0.830980
    const f = catenary()
    expect(Math.abs(f.darkByClass[1] - 0.83098)).toBeLessThanOrEqual(3 * se(0.83098))
    expect(f.darkByClass[0] + f.darkByClass[1]).toBeCloseTo(f.pDarkWithinHorizon, 9)
  })

  it('with the fuse-lamp exponent it goes first more often still', () => {
    // Over rating (r = 240/239 > 1 from the start, higher after each short) a larger exponent means a
    // shorter life, so the fuse lamp fails earlier in the order than an exchangeable lamp: fewer
    // shunts get the chance to open first, and its share rises above 0.830980.
    const f = catenary(FUSE_LAMP_LIFE_EXPONENT)
    expect(f.darkByClass[1]).toBeGreaterThan(0.83098 + 3 * se(0.83098))
  })
})

describe('forecast: LED strings', () => {
  it('ages LED sections by plain hours and puts a series chain out at its first failure', () => {
    // Four LED sections in series, rated life L = 50,000 h taken as the median (e.g. L70), shape 2.
    // The chain is dark at the first failure: P(lit at t) = exp(−4 (t/η)²) with η = L / √ln2, so
    // the median is η · √(ln2 / 4) = L / 2 = 25,000 h, whatever the supply within the driver range.
    const led = (supplyVolts: number) =>
      forecast({
        supplyVolts,
        technology: 'led',
        lamps: [{ count: 4, ratedVolts: 57.5, ratedAmps: 0.1 }],
        ratedLifeHours: 50000,
        weibullShape: 2,
        trials: TRIALS,
      })
    const at245 = led(245)
    expect(Math.abs(at245.medianHoursToDark! - 25000)).toBeLessThan(0.02 * 25000)
    expect(led(207)).toEqual(at245)
    expect(at245.darkByClass).toEqual([at245.pDarkWithinHorizon])
  })

  it('keeps parallel LED modules lit until the last one fails', () => {
    // Two parallel modules on 26 V (rated 24 V), shape 1, median L. No acceleration from the supply,
    // so P(dark by L) = (1 − 2^−1)² = 0.25 (independent); filament lamps at d = 13 would age
    // (26/24)^13 = 2.83 times faster.
    const f = forecast({
      supplyVolts: 26,
      wiring: 'parallel',
      lamps: [{ count: 2, ratedVolts: 24, ratedAmps: 0.5, technology: 'led' }],
      ratedLifeHours: 1000,
      weibullShape: 1,
      pDarkAt: [1000],
      trials: TRIALS,
    })
    expect(Math.abs(f.pDarkAt[0].p - 0.25)).toBeLessThanOrEqual(3 * se(0.25))
  })
})

describe('forecast: parallel chains (branches)', () => {
  // Two chains of two shunted lamps, no voltage acceleration (d = 0), shape 1, median L; no shunt
  // opens, so a chain is out when both its lamps have failed, and the string counts as dark when
  // its first chain goes out. Per lamp P(failed by L) = 1/2.
  const base = {
    supplyVolts: 24,
    branches: 2,
    ratedLifeHours: 1000,
    weibullShape: 1,
    lifeExponent: 0,
    shuntFailProbability: 0,
    pDarkAt: [1000],
    trials: TRIALS,
  }

  it('counts the string dark when its first chain goes out', () => {
    // P(chain out by L) = (1/2)² = 1/4; P(string dark) = 1 − (1 − 1/4)² = 0.4375.
    // Median: (1 − (1 − x)²)² = 1/2 with x = e^(−λt): x = 1 − √(1 − √½) = 0.458804, so
    // t = −ln x / ln 2 · L = 1.124050 L (bc -l).
    const f = forecast({ ...base, lamps: [{ count: 2, ratedVolts: 12, ratedAmps: 0.5 }] })
    expect(Math.abs(f.pDarkAt[0].p - 0.4375)).toBeLessThanOrEqual(3 * se(0.4375))
    expect(Math.abs(f.medianHoursToDark! - 1124.05)).toBeLessThan(0.03 * 1124.05)
  })

  it('places failures counted over the string in the first chain', () => {
    // One lamp failed (shorted) sits in chain 1, which has one lamp left: P(lit at L) =
    // P(chain 1 lit) · P(chain 2 lit) = 1/2 · 3/4 = 0.375, so P(dark by L) = 0.625.
    const f = forecast({ ...base, lamps: [{ count: 2, ratedVolts: 12, ratedAmps: 0.5, failed: 1 }] })
    expect(Math.abs(f.pDarkAt[0].p - 0.625)).toBeLessThanOrEqual(3 * se(0.625))
  })

  it('follows the chains still lit when one is open or has a lamp removed', () => {
    // Chain 1 is out (its sockets live: assess says so); chain 2's two lamps both have to fail:
    // P(dark by L) = (1/2)² = 0.25.
    for (const fault of [{ opened: 1 }, { removed: 1 }]) {
      const f = forecast({ ...base, lamps: [{ count: 2, ratedVolts: 12, ratedAmps: 0.5, ...fault }] })
      expect(Math.abs(f.pDarkAt[0].p - 0.25)).toBeLessThanOrEqual(3 * se(0.25))
      expect(f.pReached.length).toBe(2)
      // With one chain only, the string is dark now.
      const one = forecast({
        ...base,
        branches: 1,
        lamps: [{ count: 2, ratedVolts: 12, ratedAmps: 0.5, ...fault }],
      })
      expect(one.medianHoursToDark).toBe(0)
      expect(one.meanHoursToFailure).toEqual([])
    }
  })

  it('counts a removed lamp of a parallel string as one lamp fewer', () => {
    // 2 × 2 lamps in parallel, one removed: 3 lamps left, dark when all 3 have failed:
    // P(dark by L) = (1/2)³ = 0.125.
    const f = forecast({
      ...base,
      wiring: 'parallel',
      supplyVolts: 12,
      lamps: [{ count: 2, ratedVolts: 12, ratedAmps: 0.5, removed: 1 }],
    })
    expect(f.pReached.length).toBe(3)
    expect(Math.abs(f.pDarkAt[0].p - 0.125)).toBeLessThanOrEqual(3 * se(0.125))
  })
})
