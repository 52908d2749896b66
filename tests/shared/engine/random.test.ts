import { describe, expect, it } from 'vitest'
import { nextExponential, nextUniform, randomState } from '../../../shared/engine'
import { power, powerTable } from '../../../shared/engine/forecast-power'

describe('ziggurat exponential draws (Marsaglia & Tsang 2000)', () => {
  const n = 400000
  const st = randomState(3)
  const draws = Float64Array.from({ length: n }, () => nextExponential(st))

  it('has mean 1 and variance 1', () => {
    // Unit exponential: mean 1, variance 1 (definition). Standard error of the mean 1/√n; of the
    // sample variance √((μ4 − σ⁴)/n) = √(8/n) (μ4 = 9 for the unit exponential).
    const mean = draws.reduce((a, b) => a + b, 0) / n
    const variance = draws.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1)
    expect(Math.abs(mean - 1)).toBeLessThan(4 / Math.sqrt(n))
    expect(Math.abs(variance - 1)).toBeLessThan(4 * Math.sqrt(8 / n))
  })

  it('has the exponential tail, also beyond the base layer (x > 7.697)', () => {
    // P(X > x) = e^−x (definition); binomial standard error √(p(1 − p)/n).
    const sorted = draws.slice().sort()
    for (const x of [0.1, 0.5, 1, 2, 4, 7.8, 9]) {
      const p = Math.exp(-x)
      const first = sorted.findIndex((d) => d > x)
      const share = first < 0 ? 0 : (n - first) / n
      expect(Math.abs(share - p)).toBeLessThan(4 * Math.sqrt((p * (1 - p)) / n) + 1 / n)
    }
  })

  it('draws uniforms in [0, 1) with mean one half', () => {
    // Uniform on [0, 1): mean 1/2, standard error √(1/12n).
    const u = Float64Array.from({ length: n }, () => nextUniform(st))
    expect(u.reduce((a, b) => Math.min(a, b), 1)).toBeGreaterThanOrEqual(0)
    expect(u.reduce((a, b) => Math.max(a, b), 0)).toBeLessThan(1)
    expect(Math.abs(u.reduce((a, b) => a + b, 0) / n - 0.5)).toBeLessThan(4 * Math.sqrt(1 / (12 * n)))
  })
})

describe('power tables (x^γ without Math.pow)', () => {
  it('gives exact powers where they are known by hand', () => {
    expect(power(powerTable(1 / 3), 27)).toBeCloseTo(3, 11)
    expect(power(powerTable(0.5), 2)).toBeCloseTo(1.41421356237, 10) // √2
    expect(power(powerTable(1 / 2.8), 1)).toBe(1)
    expect(power(powerTable(2), 1e-3)).toBeCloseTo(1e-6, 16)
    expect(power(powerTable(0.5), 0)).toBe(0)
  })

  it('agrees with the runtime power to 1e-10 across the range the forecast uses', () => {
    // Shapes 0.2 to 10 in the schema: γ = 1/β from 0.1 to 5.
    for (const gamma of [0.1, 1 / 2.8, 1 / 1.5, 2, 5]) {
      const table = powerTable(gamma)
      for (let e = -30; e <= 30; e += 0.37) {
        const x = Math.exp(e)
        expect(Math.abs(power(table, x) / x ** gamma - 1)).toBeLessThan(1e-10)
      }
    }
  })
})
