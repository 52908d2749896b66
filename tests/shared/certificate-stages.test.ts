// When a certificate reaches each reminder (shared/schemas/certificates.ts): 30 and 14 days before its
// next due date and on the day itself. The thresholds are common practice, no source; each boundary
// below is counted by hand.
import { describe, expect, it } from 'vitest'
import { reminderStage } from '../../shared/schemas/certificates'
import { kindsForSubject } from '../../shared/vocab/certificates'

describe('reminderStage', () => {
  it('is null more than 30 days out and the 30-day stage from 30 down to 15 days', () => {
    expect(reminderStage(31)).toBeNull()
    expect(reminderStage(30)).toBe('days_30')
    expect(reminderStage(15)).toBe('days_30')
  })

  it('is the 14-day stage from 14 down to 1 day, and expired on the due day and after', () => {
    expect(reminderStage(14)).toBe('days_14')
    expect(reminderStage(1)).toBe('days_14')
    expect(reminderStage(0)).toBe('expired')
    expect(reminderStage(-40)).toBe('expired')
  })
})

describe('kindsForSubject', () => {
  it('gives a platform its examinations and a circuit its electrical tests (trade-reference §5, §7)', () => {
    expect(kindsForSubject.platform).toEqual(['platform_exam', 'platform_pre_use'])
    expect(kindsForSubject.circuit).toEqual(['rcd_test', 'insulation_test'])
    expect(kindsForSubject.structure).toEqual(['column_structural', 'anchor_test'])
  })
})
