import { describe, expect, it } from 'vitest'
import { brightLampsAdvice, brightLampsError, lampTotal } from '../../shared/visit-rules'
import { visitBody } from '../../shared/schemas/visits'
import { ISOLATION_CAUTION, liveSocketCodes } from '../../shared/engine/reason-codes'
import { checkDraft, newDraft, toVisitBody } from '../../src/components/visit/visit-draft'

// Bright lamps (trade-reference §2a, a bench observation, common practice): coils stuck together
// after a knock; isolate, tap the lamp so the coils separate, stop the string swinging.
describe('bright lamps on a visit', () => {
  it('counts every lamp of every chain as one that can be bright', () => {
    // CAT-F20: 19 + 1 lamps in one chain = 20 (shared/lamp-catalogue.ts).
    expect(lampTotal({ classes: [{ count: 19 }, { count: 1 }] })).toBe(20)
    // Two parallel chains of the same 20 lamps: 2 × 20 = 40.
    expect(lampTotal({ classes: [{ count: 19 }, { count: 1 }], branches: 2 })).toBe(40)
  })

  it('refuses more bright lamps than the string holds, in the words the crew sees', () => {
    expect(brightLampsError(21, 20)).toBe('This string has 20 lamps; 21 cannot be bright.')
    expect(brightLampsError(20, 20)).toBeUndefined()
    expect(visitBody.safeParse({ stringId: 1, failedFound: 0, replaced: 0, brightLamps: -1 }).success).toBe(
      false,
    )
  })

  it('gives the advice with a live-socket code, and none for no bright lamps', () => {
    expect(brightLampsAdvice(0)).toBeNull()
    const a = brightLampsAdvice(2)!
    expect(a.code).toBe('bright_lamps')
    expect(liveSocketCodes).toContain(a.code) // so the isolation caution shows beside it
    expect(a.text).toMatch(/^2 lamps are brighter/)
    for (const step of [/isolate/i, /tap each bright lamp/i, /swinging against hard surfaces/i])
      expect(a.text).toMatch(step)
    expect(brightLampsAdvice(1)!.text).toMatch(/^1 lamp is brighter/)
    expect(ISOLATION_CAUTION).toMatch(/full supply voltage/)
  })

  it('keeps the count in the phone draft, sends it, and checks it before queueing', () => {
    const d = { ...newDraft(1, 'WF-HS-012'), brightLamps: 3 }
    expect(toVisitBody(d, '2026-12-02T18:00:00+00:00').brightLamps).toBe(3)
    // A draft saved before the field existed sends none.
    const old = { ...newDraft(1, 'WF-HS-012') } as Partial<typeof d>
    delete old.brightLamps
    expect(toVisitBody(old as typeof d, '2026-12-02T18:00:00+00:00').brightLamps).toBe(0)
    expect(checkDraft({ ...d, brightLamps: 21 }, 0, 19, 20).brightLamps).toBe(
      'This string has 20 lamps; 21 cannot be bright.',
    )
    expect(checkDraft(d, 0, 19, 20)).toEqual({})
  })
})
