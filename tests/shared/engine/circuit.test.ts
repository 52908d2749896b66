import { describe, expect, it } from 'vitest'
import { assessCircuit, staggerGroups, stringLoad, switchOnVerdict } from '../../../shared/engine'

describe('breaker instantaneous bands', () => {
  it('places switch-on current against the curve bands of IEC 60898-1', () => {
    // IEC 60898-1: type B trips instantly at 3–5 × rated current (trade-reference §5); C 5–10 ×,
    // D 10–20 × (same standard; memory, not in the reference).
    expect(switchOnVerdict(17.9, 6, 'B')).toBe('safe')
    expect(switchOnVerdict(18, 6, 'B')).toBe('may trip')
    expect(switchOnVerdict(30, 6, 'B')).toBe('will trip')
    expect(switchOnVerdict(59, 6, 'C')).toBe('may trip')
    expect(switchOnVerdict(60, 6, 'C')).toBe('will trip')
    expect(switchOnVerdict(59, 6, 'D')).toBe('safe')
    expect(switchOnVerdict(119, 6, 'D')).toBe('may trip')
  })
})

describe('string switch-on current', () => {
  it('draws roughly 10–15 × running current from cold for a filament string', () => {
    // Wikipedia "Incandescent light bulb": cold ≈ 1/15 of hot; Lamptech: inrush ≈ 14 × normal;
    // trade-reference §2: roughly 10–15 times the running current.
    const s = stringLoad({ supplyVolts: 240, lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.25 }] })
    expect(s.runningAmps).toBeCloseTo(0.25, 9)
    expect(s.peakAmps / s.runningAmps).toBeGreaterThanOrEqual(10)
    expect(s.peakAmps / s.runningAmps).toBeLessThanOrEqual(15.05)
  })

  it('uses the inrush multiple for LED strings', () => {
    const s = stringLoad({
      supplyVolts: 230,
      wiring: 'parallel',
      technology: 'led',
      ledInrushMultiple: 3,
      lamps: [{ count: 12, ratedVolts: 230, ratedAmps: 0.01 }],
    })
    expect(s.runningAmps).toBeCloseTo(0.12, 9)
    expect(s.peakAmps).toBeCloseTo(0.36, 9)
  })
})

describe('circuit assessment', () => {
  const eight = Array.from({ length: 8 }, () => ({ runningAmps: 0.25, peakAmps: 3.75, watts: 60 }))

  it('keeps a continuous load to 80 % of the breaker', () => {
    // NEC 210.21(B)(2): cord-and-plug load at most 80 % of a 15 A receptacle, 12 A (trade-reference §5).
    const at = (amps: number) =>
      assessCircuit({
        supplyVolts: 120,
        breakerAmps: 15,
        curve: 'B',
        strings: [{ runningAmps: amps, peakAmps: amps }],
      })
    expect(at(12).continuousLimitAmps).toBeCloseTo(12, 9)
    expect(at(12).runningOk).toBe(true)
    expect(at(12.1).runningOk).toBe(false)
  })

  it('suggests staggering a surge that reaches the type B band', () => {
    // 8 strings × 3.75 A surge = 30 A on a 6 A type B: at the 5 × edge (IEC 60898-1). Four strings
    // surge 15 A < 18 A; the next four surge 15 A on top of the first four running (1 A): 2 groups.
    const r = assessCircuit({ supplyVolts: 240, breakerAmps: 6, curve: 'B', strings: eight })
    expect(r.switchOn).toBe('will trip')
    expect(r.instantaneousBand).toEqual({ lowAmps: 18, highAmps: 30 })
    expect(r.staggerGroups).toBe(2)
    expect(r.reasons[1]).toMatch(/2 staggered groups/)
  })

  it('cannot stagger a string whose own surge reaches the band', () => {
    expect(staggerGroups([{ runningAmps: 1, peakAmps: 20 }], 18)).toBeNull()
  })

  it('checks the RCD for additional protection and standing leakage', () => {
    // BS 7671 reg 415.1.1: additional protection needs IΔn ≤ 30 mA. BS EN 61008-1: must not trip at
    // 0.5 × IΔn, so leakage at or above half the rating may trip it.
    const base = { supplyVolts: 240, breakerAmps: 6, curve: 'B' as const }
    const ok = assessCircuit({
      ...base,
      rcdMilliamps: 30,
      strings: [{ runningAmps: 1, peakAmps: 1, leakageMilliamps: 14 }],
    })
    expect(ok.rcd).toEqual({ leakageMilliamps: 14, additionalProtection: true, risk: 'ok' })
    const leaky = assessCircuit({
      ...base,
      rcdMilliamps: 30,
      strings: [{ runningAmps: 1, peakAmps: 1, leakageMilliamps: 15 }],
    })
    expect(leaky.rcd!.risk).toBe('may trip')
    expect(assessCircuit({ ...base, rcdMilliamps: 100, strings: eight }).rcd!.additionalProtection).toBe(
      false,
    )
    expect(assessCircuit({ ...base, strings: eight }).rcd).toBeNull()
  })

  it('prices energy per night and per season', () => {
    // 480 W × 7 h = 3.36 kWh a night; × 42 nights = 141.12 kWh; at 0.30 a kWh.
    const r = assessCircuit({
      supplyVolts: 240,
      breakerAmps: 6,
      curve: 'B',
      strings: eight,
      burnHoursPerDay: 7,
      seasonDays: 42,
      tariffPerKwh: 0.3,
    })
    expect(r.energy.kwhPerNight).toBeCloseTo(3.36, 9)
    expect(r.energy.kwhPerSeason).toBeCloseTo(141.12, 9)
    expect(r.energy.costPerSeason).toBeCloseTo(42.336, 9)
  })
})
