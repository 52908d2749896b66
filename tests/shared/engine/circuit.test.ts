import { describe, expect, it } from 'vitest'
import { assessCircuit, staggerGroups, stringLoad, switchOnVerdict } from '../../../shared/engine'

const eight = Array.from({ length: 8 }, () => ({ runningAmps: 0.25, peakAmps: 3.75, watts: 60 }))

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
    expect(r.reasons[1]).toMatchObject({
      code: 'surge_over_band',
      text: expect.stringMatching(/2 staggered groups/),
    })
  })

  it('cannot stagger a string whose own surge reaches the band', () => {
    expect(staggerGroups([{ runningAmps: 1, peakAmps: 20 }], 18)).toBeNull()
  })

  it('fails a circuit whose running current is over the breaker rating, whatever the surge', () => {
    // 17 × 1 A running on a 16 A breaker: over the rating, the thermal release trips on overload
    // (IEC 60898-1); surge 17 × 2 A = 34 A is below the type B band (48–80 A), so only overload decides.
    const over = Array.from({ length: 17 }, () => ({ runningAmps: 1, peakAmps: 2 }))
    const r = assessCircuit({ supplyVolts: 230, breakerAmps: 16, curve: 'B', strings: over })
    expect(r.overload).toBe(true)
    expect(r.switchOn).toBe('will trip')
    expect(r.staggerGroups).toBeNull()
    expect(r.reasons[0].code).toBe('running_over_rating')
    expect(r.reasons[0].text).toMatch(/16 A rating/)
    // 16 × 1 A = 16 A: at the rating, not over it; still over the 80 % continuous limit (12.8 A).
    const at = assessCircuit({ supplyVolts: 230, breakerAmps: 16, curve: 'B', strings: over.slice(1) })
    expect(at).toMatchObject({ overload: false, runningOk: false, switchOn: 'safe' })
    expect(at.reasons[0].code).toBe('running_over_continuous')
  })

  it('takes an LED driver inrush pulse shorter than a half-cycle as a conservative comparison', () => {
    // 4 drivers × 15 A peak = 60 A on a 16 A type B: inside 48–80 A. Pulse 0.2 ms < 10 ms (50 Hz).
    const leds = Array.from({ length: 4 }, () => ({ runningAmps: 0.2, peakAmps: 15, peakMs: 0.2 }))
    const r = assessCircuit({ supplyVolts: 230, breakerAmps: 16, curve: 'B', strings: leds })
    expect(r.switchOn).toBe('may trip')
    expect(r.reasons.map((x) => x.code)).toContain('surge_short_pulse')
  })
})

describe('LED strings without switch-on data', () => {
  it('says the surge is unknown rather than assuming one', () => {
    const r = assessCircuit({
      supplyVolts: 230,
      breakerAmps: 6,
      curve: 'B',
      strings: [{ runningAmps: 0.2, peakAmps: 0.2, surgeKnown: false }, ...eight.slice(0, 1)],
    })
    const unknown = r.reasons.find((x) => x.code === 'surge_unknown')
    expect(unknown?.text).toMatch(/^1 LED string has no switch-on data/)
  })
})

describe('circuit RCD', () => {
  const base = { supplyVolts: 240, breakerAmps: 6, curve: 'B' as const }
  const leak = (mA: number) => [{ runningAmps: 1, peakAmps: 1, leakageMilliamps: mA }]

  it('flags standing leakage above 30 % of IΔn (BS 7671 reg 531.3.2, memory)', () => {
    // 30 % × 30 mA = 9 mA: 9 mA is within, 9.5 mA over. 50 % × 30 mA = 15 mA: BS EN 61008-1 no-trip
    // point, at or above it the RCD may trip on leakage alone.
    const at = (mA: number) => assessCircuit({ ...base, rcdMilliamps: 30, strings: leak(mA) }).rcd!
    expect(at(9)).toEqual({
      rcdType: 'general',
      leakageMilliamps: 9,
      leakageLimitMilliamps: 9,
      additionalProtection: true,
      risk: 'ok',
    })
    expect(at(9.5).risk).toBe('high')
    expect(at(14).risk).toBe('high') // "ok" under the old 50 % rule
    expect(at(15).risk).toBe('may trip')
  })

  it('uses the measured circuit leakage over the strings, and never assumes zero', () => {
    const measured = assessCircuit({ ...base, rcdMilliamps: 30, leakageMilliamps: 12, strings: leak(2) })
    expect(measured.rcd!.leakageMilliamps).toBe(12)
    const none = assessCircuit({ ...base, rcdMilliamps: 30, strings: [{ runningAmps: 1, peakAmps: 1 }] })
    expect(none.rcd).toMatchObject({ leakageMilliamps: null, risk: 'not measured' })
    expect(none.reasons.map((x) => x.code)).toContain('leakage_not_measured')
  })

  it('gives no additional protection over 30 mA or with a time-delayed RCD (BS 7671 reg 415.1.1)', () => {
    // 415.1.1: IΔn ≤ 30 mA and ≤ 40 ms at 5 ×; BS EN 61008-1 allows a type S 50–150 ms at 5 ×.
    const eightRcd = (rcdMilliamps: number, rcdType: 'general' | 'S') =>
      assessCircuit({ ...base, rcdMilliamps, rcdType, strings: eight })
    expect(eightRcd(30, 'general').rcd!.additionalProtection).toBe(true)
    expect(eightRcd(100, 'general').rcd!.additionalProtection).toBe(false)
    const s = eightRcd(30, 'S')
    expect(s.rcd).toMatchObject({ rcdType: 'S', additionalProtection: false })
    expect(s.reasons.find((x) => x.code === 'rcd_no_additional_protection')?.text).toMatch(/time-delayed/)
    expect(assessCircuit({ ...base, strings: eight }).rcd).toBeNull()
  })
})

describe('circuit energy', () => {
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
