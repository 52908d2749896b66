import { describe, expect, it } from 'vitest'
import { judgeReadings, type Readings } from '../../shared/test-limits'

const rcd = (r: Readings) => judgeReadings('rcd_test', r)
const codes = (r: Readings) => rcd(r)?.findings.map((f) => f.code)

describe('general-type RCD readings', () => {
  // BS EN 61008-1 / 61009-1 general type: ≤ 300 ms at 1 × IΔn, ≤ 150 ms at 2 ×, ≤ 40 ms at 5 ×, no
  // trip at ½ × (trade-reference §5).
  it('passes a 30 mA RCD that holds at ½×, trips in 24 ms at 1×, 18 ms at 2× and 12 ms at 5×', () => {
    const r = rcd({ ratedMa: 30, noTripAtHalf: true, tripMsAt1x: 24, tripMsAt2x: 18, tripMsAt5x: 12 })
    expect(r).toMatchObject({ result: 'pass', findings: [] })
  })
  it('fails one taking 52 ms at 5 × IΔn (limit 40 ms, BS EN 61008-1)', () => {
    const r = rcd({ ratedMa: 30, tripMsAt1x: 24, tripMsAt5x: 52 })
    expect(r?.result).toBe('fail')
    expect(r?.findings[0]).toMatchObject({ code: 'rcd_slow', level: 'fail' })
    expect(r?.reasons[0]).toMatch(/40 ms/)
    expect(r?.reasons[0]).toMatch(/BS EN 61008-1/)
  })
  it('fails one taking 310 ms at 1 × IΔn (limit 300 ms)', () => {
    expect(rcd({ tripMsAt1x: 310 })?.result).toBe('fail')
    expect(rcd({ tripMsAt1x: 300 })?.result).toBe('pass') // at the limit is within it
  })
  it('checks 2 × IΔn: 151 ms fails, 150 ms passes (limit 150 ms, BS EN 61008-1)', () => {
    expect(codes({ tripMsAt2x: 151 })).toEqual(['rcd_slow'])
    expect(rcd({ tripMsAt2x: 150 })?.result).toBe('pass')
  })
  it('fails one that tripped at ½ × IΔn (must not trip, BS EN 61008-1)', () => {
    const r = rcd({ ratedMa: 30, noTripAtHalf: false, tripMsAt1x: 24 })
    expect(r?.result).toBe('fail')
    expect(r?.findings[0].code).toBe('rcd_tripped_at_half')
    expect(r?.reasons[0]).toMatch(/half its rating/)
  })
  it('needs a reading to decide: a rating alone leaves the result to the inspector', () => {
    expect(rcd({ ratedMa: 30 })).toBeNull()
    expect(rcd({ ratedMa: 30, noTripAtHalf: true })?.result).toBe('pass')
  })
  it('judges a stored reading without rcdType as general type', () => {
    // 120 ms at 1× passes a general type (≤ 300 ms) but would fail an S type (≥ 130 ms).
    expect(rcd({ ratedMa: 30, tripMsAt1x: 120 })?.result).toBe('pass')
  })
})

describe('time-delayed (S) RCD readings', () => {
  // BS EN 61008-1 / 61009-1 type S: 130–500 ms at 1 × IΔn, 60–200 ms at 2 ×, 50–150 ms at 5 ×
  // (trade-reference §5). A 100 mA S type upstream is a common design for discrimination.
  const s = (r: Readings) => rcd({ ratedMa: 100, rcdType: 'S', ...r })

  it('does not fail an S type for the general limits it is not meant to meet', () => {
    // 90 ms at 5× would fail a general type (≤ 40 ms); inside the S window (50–150 ms) it is right.
    const r = s({ noTripAtHalf: true, tripMsAt1x: 200, tripMsAt2x: 120, tripMsAt5x: 90 })
    expect(r?.findings.filter((f) => f.level === 'fail')).toEqual([])
  })
  it('fails an S type that is too fast: 40 ms at 5× (floor 50 ms) and 100 ms at 1× (floor 130 ms)', () => {
    const r = s({ tripMsAt1x: 100, tripMsAt5x: 40 })
    expect(r?.result).toBe('fail')
    expect(r?.findings.filter((f) => f.level === 'fail').map((f) => f.code)).toEqual([
      'rcd_too_fast',
      'rcd_too_fast',
    ])
    expect(r?.reasons[0]).toMatch(/130–500 ms/)
    expect(r?.reasons[0]).toMatch(/downstream/)
  })
  it('fails an S type too slow: 510 ms at 1×, 210 ms at 2×, 160 ms at 5×', () => {
    expect(codes({ rcdType: 'S', tripMsAt1x: 510, tripMsAt2x: 210, tripMsAt5x: 160 })).toEqual([
      'rcd_slow',
      'rcd_slow',
      'rcd_slow',
      'no_additional_protection',
    ])
  })
  it('accepts the window edges: 130 and 500 ms at 1×, 60 and 200 ms at 2×, 50 and 150 ms at 5×', () => {
    for (const r of [
      { tripMsAt1x: 130, tripMsAt2x: 60, tripMsAt5x: 50 },
      { tripMsAt1x: 500, tripMsAt2x: 200, tripMsAt5x: 150 },
    ])
      expect(s(r)?.findings.some((f) => f.level === 'fail')).toBe(false)
  })
  it('reports that an S type gives no additional protection (BS 7671 reg 415.1.1), as advisory', () => {
    // Even a 30 mA S type: additional protection needs ≤ 40 ms at 5 ×, an S type is allowed 50–150 ms.
    const r = rcd({ ratedMa: 30, rcdType: 'S', tripMsAt1x: 200, tripMsAt5x: 90 })
    expect(r?.result).toBe('advisory')
    expect(r?.findings).toEqual([expect.objectContaining({ code: 'no_additional_protection' })])
    expect(r?.reasons[0]).toMatch(/415\.1\.1/)
  })
})

describe('additional protection and standing leakage on the RCD test', () => {
  it('marks a 100 mA general-type device advisory: it works, but is not additional protection', () => {
    // BS 7671 reg 415.1.1: additional protection needs IΔn ≤ 30 mA.
    const r = rcd({ ratedMa: 100, tripMsAt1x: 20, tripMsAt5x: 10 })
    expect(r?.result).toBe('advisory')
    expect(r?.findings[0].code).toBe('no_additional_protection')
  })
  it('flags leakage above 30 % of IΔn (BS 7671 reg 531.3.2, memory): 9 mA on 30 mA is fine, 9.5 mA is not', () => {
    // 30 % × 30 mA = 9 mA.
    expect(rcd({ ratedMa: 30, tripMsAt1x: 20, leakageMa: 9 })?.result).toBe('pass')
    const r = rcd({ ratedMa: 30, tripMsAt1x: 20, leakageMa: 9.5 })
    expect(r?.result).toBe('advisory')
    expect(r?.findings[0].code).toBe('leakage_high')
    expect(r?.reasons[0]).toMatch(/9 mA/)
  })
  it('says a leakage of half IΔn or more may trip the RCD (BS EN 61008-1 no-trip point): 15 mA on 30 mA', () => {
    // 50 % × 30 mA = 15 mA.
    expect(rcd({ ratedMa: 30, tripMsAt1x: 20, leakageMa: 15 })?.reasons[0]).toMatch(/may trip/)
  })
})
