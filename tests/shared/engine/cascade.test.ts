import { describe, expect, it } from 'vitest'
import { expectedTimeToKthFailure, varianceTimeToKthFailure } from '../../../shared/engine'

describe('closed-form cascade (trade-reference §3; Rényi representation, Kamps 1995)', () => {
  it('reproduces the published E[T_5] for n = 50, λ0 = 1/1000 h', () => {
    // trade-reference §3: E[T_5] = 104.3 h with p = 0 and 66.9 h with p = 12.
    expect(expectedTimeToKthFailure(50, 1 / 1000, 0, 5)).toBeCloseTo(104.3, 1)
    expect(expectedTimeToKthFailure(50, 1 / 1000, 12, 5)).toBeCloseTo(66.9, 1)
  })

  it('reduces to harmonic numbers without load sharing', () => {
    // trade-reference §3: with p = 0, E[T_k] = (H_n − H_{n−k}) / λ0.
    const h = (n: number) => Array.from({ length: n }, (_, i) => 1 / (i + 1)).reduce((a, b) => a + b, 0)
    expect(expectedTimeToKthFailure(20, 0.002, 0, 7)).toBeCloseTo((h(20) - h(13)) / 0.002, 9)
  })

  it('gives the variance of a sum of independent exponential gaps', () => {
    // trade-reference §3: Var[T_k] = Σ 1 / ((n − i) · λi)²; for k = 1 that is 1 / (n λ0)².
    expect(varianceTimeToKthFailure(50, 1 / 1000, 12, 1)).toBeCloseTo(20 ** 2, 9)
    const gaps = [0, 1].map((i) => 1 / ((10 - i) * 0.01 * (10 / (10 - i)) ** 13))
    expect(varianceTimeToKthFailure(10, 0.01, 13, 2)).toBeCloseTo(gaps[0] ** 2 + gaps[1] ** 2, 9)
  })

  it('rejects k beyond the number of lamps', () => {
    expect(() => expectedTimeToKthFailure(5, 0.001, 12, 6)).toThrow(RangeError)
  })
})
