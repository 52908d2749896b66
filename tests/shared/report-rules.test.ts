// The public report's plain checks (shared/report-rules.ts), which the report page runs without zod,
// against the product's own words and against the server's zod schema: a form the page lets through
// must be one the server takes, and one the server refuses must be stopped on the page first.
import { describe, expect, it } from 'vitest'
import { REF_PATTERN, reportProblems, type ReportDraft } from '../../shared/report-rules'
import { reportBody } from '../../shared/schemas/reports'

describe('references', () => {
  it('look like LW-7K3QD (product brief, "a public fault report": references like `LW-7K3QD`)', () => {
    expect(REF_PATTERN.test('LW-7K3QD')).toBe(true)
    expect(REF_PATTERN.test('LW-7K3Q')).toBe(false)
    expect(REF_PATTERN.test('lw-7k3qd')).toBe(false)
    expect(REF_PATTERN.test('LW 7K3QD')).toBe(false)
  })
})

describe('the page and the server agree', () => {
  // Hand-written cases: each says where (or not), says enough (or not), with a good or bad address.
  const drafts: ReportDraft[] = [
    { tag: 'WF-HS-014', description: 'Half the lamps are out.' },
    { street: 'Market Row', description: 'Whole string dark.' },
    { lat: 51.5, lng: -0.12, description: 'Cable hanging low over the path.' },
    { description: 'Whole string dark.' },
    { tag: '   ', street: '  ', description: 'Whole string dark.' },
    { tag: 'WF-HS-014', description: 'Dim' },
    { tag: 'WF-HS-014', description: '    Dim    ' },
    { tag: 'WF-HS-014', description: 'Whole string dark.', email: 'someone@example.org' },
    { tag: 'WF-HS-014', description: 'Whole string dark.', email: 'someone at example' },
    { tag: 'WF-HS-014', description: 'Whole string dark.', email: 'someone@example' },
  ]
  it.each(drafts)('%o', (draft) => {
    const pageSends = Object.keys(reportProblems(draft)).length === 0
    expect(pageSends).toBe(reportBody.safeParse(draft).success)
  })

  it('names the field and says what to do', () => {
    expect(reportProblems({ description: 'Dim' })).toEqual({
      description: 'Tell us a little about the fault.',
      street: 'Give the number on the lights, the street, or your location.',
    })
  })
})
