import { describe, expect, it } from 'vitest'
import { stringLoad } from '../../../shared/engine'

describe('stringLoad', () => {
  const led = { supplyVolts: 230, technology: 'led' as const, wiring: 'parallel' as const }
  const modules = [{ count: 12, ratedVolts: 230, ratedAmps: 0.01, shunted: false }]

  it('gives an LED string’s amps as watts ÷ (volts × power factor)', () => {
    // Hand calculation: 12 × 230 V × 0.01 A = 27.6 VA; PF 0.9 → 24.84 W; 24.84 / (230 × 0.9) = 0.12 A.
    const s = stringLoad({ ...led, powerFactor: 0.9, lamps: modules })
    expect(s.runningAmps).toBeCloseTo(0.12, 12)
    expect(s.watts).toBeCloseTo(24.84, 9)
    expect(s.voltAmps).toBeCloseTo(27.6, 9)
    expect(s.watts / (230 * s.powerFactor)).toBeCloseTo(s.runningAmps, 12)
  })

  it('takes the LED switch-on peak from the type’s data, and says when it has none', () => {
    const known = stringLoad({ ...led, inrushPeakAmps: 6, inrushMs: 0.2, lamps: modules })
    expect(known).toMatchObject({ peakAmps: 6, peakMs: 0.2, surgeKnown: true })
    const unknown = stringLoad({ ...led, lamps: modules })
    expect(unknown).toMatchObject({ surgeKnown: false, peakMs: null })
    expect(unknown.peakAmps).toBeCloseTo(unknown.runningAmps, 12)
  })

  it('adds the chains side by side, running and switch-on alike', () => {
    // Hand: one chain of 20 × 12 V 0.25 A on 240 V runs at r = 1, 0.25 A; two chains 0.5 A, and
    // twice one chain's switch-on current (each chain sees the whole supply).
    const one = stringLoad({ supplyVolts: 240, lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25 }] })
    const two = stringLoad({
      supplyVolts: 240,
      branches: 2,
      lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25 }],
    })
    expect(two.runningAmps).toBeCloseTo(0.5, 12)
    expect(two.watts).toBeCloseTo(120, 9)
    expect(two.peakAmps).toBeCloseTo(2 * one.peakAmps, 9)
  })

  it('takes the filament switch-on current from the hot/cold ratio, 11 unless the type says', () => {
    // Bench figure, trade-reference §2a (bench measurement, common practice): small series lamps run
    // about 11 × their cold resistance. Hand: 20 × 12 V 0.25 A on 240 V, hot 48 Ω a lamp, cold
    // 48 / 11 = 4.3636 Ω, string 87.273 Ω → 240 / 87.273 = 2.75 A. With a ratio of 15
    // (Wikipedia "Incandescent light bulb": cold ≈ 1/15 of hot): 240 / (20 × 3.2 Ω) = 3.75 A.
    const lamps = [{ count: 20, ratedVolts: 12, ratedAmps: 0.25 }]
    expect(stringLoad({ supplyVolts: 240, lamps }).peakAmps).toBeCloseTo(2.75, 9)
    expect(stringLoad({ supplyVolts: 240, lamps, hotColdRatio: 15 }).peakAmps).toBeCloseTo(3.75, 9)
  })

  it('marks a filament load outside the laws’ range as an extrapolation', () => {
    // r = 240 / 12 = 20 with 19 of 20 shorted: far beyond 140 % (defaults.ts, memory).
    const s = stringLoad({
      supplyVolts: 240,
      lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25, failed: 19 }],
    })
    expect(s.lawsApply).toBe(false)
  })
})
