import { describe, expect, it } from 'vitest'
import { insulationMinimumMegohms, judgeReadings } from '../../shared/test-limits'

describe('RCD test readings', () => {
  // BS EN 61008-1 / 61009-1 general type: ≤ 300 ms at 1 × IΔn, ≤ 40 ms at 5 × IΔn; BS 7671 reg 415.1.1:
  // additional protection needs IΔn ≤ 30 mA (trade-reference §5).
  it('passes a 30 mA RCD tripping in 24 ms at 1× and 12 ms at 5×', () => {
    expect(judgeReadings('rcd_test', { ratedMa: 30, tripMsAt1x: 24, tripMsAt5x: 12 })?.result).toBe('pass')
  })
  it('fails one taking 52 ms at 5 × IΔn (limit 40 ms)', () => {
    const r = judgeReadings('rcd_test', { ratedMa: 30, tripMsAt1x: 24, tripMsAt5x: 52 })
    expect(r?.result).toBe('fail')
    expect(r?.reasons[0]).toMatch(/40 ms/)
  })
  it('fails one taking 310 ms at 1 × IΔn (limit 300 ms)', () => {
    expect(judgeReadings('rcd_test', { tripMsAt1x: 310 })?.result).toBe('fail')
  })
  it('fails a 100 mA device as additional protection', () => {
    expect(judgeReadings('rcd_test', { ratedMa: 100, tripMsAt1x: 20, tripMsAt5x: 10 })?.result).toBe('fail')
  })
})

describe('insulation resistance', () => {
  // BS 7671:2018 Table 64: SELV/PELV at 250 V DC ≥ 0.5 MΩ; up to 500 V circuits at 500 V DC ≥ 1.0 MΩ.
  it('uses 0.5 MΩ at 250 V and 1.0 MΩ at 500 V and 1000 V', () => {
    expect(insulationMinimumMegohms(250)).toBe(0.5)
    expect(insulationMinimumMegohms(500)).toBe(1.0)
    expect(insulationMinimumMegohms(1000)).toBe(1.0)
  })
  it('fails 0.8 MΩ on a 230 V circuit tested at 500 V, passes 0.8 MΩ on SELV at 250 V', () => {
    expect(judgeReadings('insulation_test', { testVolts: 500, megohms: 0.8 })?.result).toBe('fail')
    expect(judgeReadings('insulation_test', { testVolts: 250, megohms: 0.8 })?.result).toBe('pass')
  })
})
