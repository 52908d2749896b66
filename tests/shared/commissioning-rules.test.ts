// Commissioning judged against published figures: clearances from trade-reference §7 (one highway
// authority's conditions: ≥ 5.2 m over a carriageway, ≥ 3.5 m over a footway, below 3 m at SELV ≤ 25 V);
// insulation from BS 7671 Table 64 (≥ 1.0 MΩ for circuits up to 500 V); RCD from BS EN 61008-1 and
// BS 7671 reg 415.1.1 (≤ 300 ms at 1 ×, ≤ 40 ms at 5 × IΔn).
import { describe, expect, it } from 'vitest'
import {
  clearanceFindings,
  judgeSeasonTest,
  lampsOutFindings,
  readingFindings,
} from '../../shared/commissioning-rules'

const codes = (f: { code: string }[]) => f.map((x) => x.code)

describe('clearance (trade-reference §7)', () => {
  it('warns below 3.5 m over a footway and not at it', () => {
    expect(codes(clearanceFindings('footway', 3.49))).toEqual(['clearance_low'])
    expect(clearanceFindings('footway', 3.5)).toEqual([])
  })
  it('warns below 5.2 m over a carriageway and not at it', () => {
    expect(codes(clearanceFindings('carriageway', 5.19))).toEqual(['clearance_low'])
    expect(clearanceFindings('carriageway', 5.2)).toEqual([])
  })
  it('asks for SELV (≤ 25 V) below 3 m', () => {
    expect(codes(clearanceFindings('footway', 2.8, 230))).toContain('selv_required')
    expect(codes(clearanceFindings('footway', 2.8, 24))).not.toContain('selv_required')
  })
  it('is a warning, never a fail', () => {
    expect(judgeSeasonTest(clearanceFindings('footway', 2.0, 230)).result).toBe('advisory')
  })
})

describe('readings judged as certificates are', () => {
  const ok = { ratedMa: 30, tripMsAt1x: 25, tripMsAt5x: 15, megohms: 50, circuitVolts: 230 }
  it('passes readings inside BS 7671 Table 64 and BS EN 61008-1', () => {
    expect(judgeSeasonTest(readingFindings(ok)).result).toBe('pass')
  })
  it('fails 0.9 MΩ on a 230 V circuit (Table 64: 1.0 MΩ)', () => {
    expect(judgeSeasonTest(readingFindings({ ...ok, megohms: 0.9 })).result).toBe('fail')
  })
  it('fails 45 ms at 5 × IΔn (reg 415.1.1: 40 ms)', () => {
    expect(judgeSeasonTest(readingFindings({ ...ok, tripMsAt5x: 45 })).result).toBe('fail')
  })
  it('fails a commissioning without an insulation or an RCD reading', () => {
    expect(codes(readingFindings({ ratedMa: 30 }))).toEqual(['insulation_missing', 'rcd_missing'])
  })
  it('notes lamps out at the switch-on test without failing', () => {
    expect(judgeSeasonTest([...readingFindings(ok), ...lampsOutFindings(2)]).result).toBe('pass')
  })
})
