import { describe, expect, it } from 'vitest'
import { insulationRequirement, judgeReadings, type Readings } from '../../shared/test-limits'

const ir = (r: Readings) => judgeReadings('insulation_test', r)

describe('insulation minimum by the circuit voltage (BS 7671:2018 Table 64, trade-reference §5)', () => {
  it('takes SELV/PELV (≤ 50 V) at 250 V DC ≥ 0.5 MΩ, up to 500 V at 500 V DC ≥ 1.0 MΩ, above at 1000 V DC ≥ 1.0 MΩ', () => {
    expect(insulationRequirement(24)).toMatchObject({ testVolts: 250, minMegohms: 0.5 })
    expect(insulationRequirement(50)).toMatchObject({ testVolts: 250, minMegohms: 0.5 })
    expect(insulationRequirement(230)).toMatchObject({ testVolts: 500, minMegohms: 1.0 })
    expect(insulationRequirement(400)).toMatchObject({ testVolts: 500, minMegohms: 1.0 })
    expect(insulationRequirement(690)).toMatchObject({ testVolts: 1000, minMegohms: 1.0 })
  })

  it('fails a 230 V circuit tested at 250 V reading 0.5 MΩ: the minimum stays 1.0 MΩ (reg 643.3, memory)', () => {
    const r = ir({ circuitVolts: 230, testVolts: 250, megohms: 0.5 })
    expect(r?.result).toBe('fail')
    expect(r?.findings.map((f) => f.code)).toEqual(['insulation_low', 'insulation_test_volts_low'])
    expect(r?.reasons[0]).toMatch(/1\.0 MΩ/)
  })

  it('marks a 230 V circuit tested at 250 V reading 2 MΩ advisory, not fail (surge protection may force it)', () => {
    const r = ir({ circuitVolts: 230, testVolts: 250, megohms: 2 })
    expect(r?.result).toBe('advisory')
    expect(r?.findings).toEqual([
      expect.objectContaining({ code: 'insulation_test_volts_low', level: 'advisory' }),
    ])
    expect(r?.reasons[0]).toMatch(/500 V DC/)
  })

  it('passes 0.8 MΩ on a 24 V SELV circuit at 250 V and fails 0.8 MΩ on a 230 V circuit at 500 V', () => {
    expect(ir({ circuitVolts: 24, testVolts: 250, megohms: 0.8 })?.result).toBe('pass')
    expect(ir({ circuitVolts: 230, testVolts: 500, megohms: 0.8 })?.result).toBe('fail')
  })

  it('judges an unknown circuit voltage as a mains circuit up to 500 V and says so', () => {
    const r = ir({ testVolts: 250, megohms: 0.8 })
    expect(r?.result).toBe('fail') // 0.8 < 1.0 MΩ
    expect(r?.findings[0]).toMatchObject({ code: 'circuit_volts_assumed', level: 'note' })
  })

  it('needs a resistance reading to decide', () => {
    expect(ir({ circuitVolts: 230, testVolts: 500 })).toBeNull()
  })
})
