import { describe, expect, it } from 'vitest'
import { checkDraft, newDraft } from '../../src/components/visit/visit-draft'

// The phone refuses a doomed visit with the server's own words (shared/visit-rules.ts), before queueing it.
describe('visit form checks', () => {
  it('shows the count messages the server would answer with', () => {
    const d = { ...newDraft(1, 'WF-HS-012'), failedFound: 3, replaced: 0 }
    expect(checkDraft(d, 17, 19).failedFound).toBe('This string has 19 lamps; 17 are already recorded out.')
    const r = { ...newDraft(1, 'WF-HS-012'), failedFound: 1, replaced: 5, isolationMode: 'none' as const }
    r.noIsolationReason = 'Isolated at the pillar by the council team.'
    expect(checkDraft(r, 2, 19)).toEqual({ replaced: 'Only 3 lamps are out (2 recorded + 1 found).' })
  })

  it('asks for 10 characters of reason when relamping without isolation', () => {
    const d = { ...newDraft(1, 'WF-HS-012'), failedFound: 1, replaced: 1, isolationMode: 'none' as const }
    d.noIsolationReason = 'Pillar 4.'
    expect(checkDraft(d, 0, 19).noIsolationReason).toBe('Say why in at least 10 characters.')
    d.noIsolationReason = 'Pillar 14.'
    expect(checkDraft(d, 0, 19)).toEqual({})
  })

  it("stamps the start with this phone's time and its offset, as the isolation record wants it", () => {
    // ISO 8601 / RFC 3339 §5.6 date-time with a numeric offset.
    expect(newDraft(1, 'WF-HS-012').startedAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d[+-]\d\d:\d\d$/)
  })
})
