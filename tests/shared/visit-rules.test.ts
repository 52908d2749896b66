import { describe, expect, it } from 'vitest'
import { applyVisit, countErrors, isRelamping } from '../../shared/visit-rules'
import { visitBody } from '../../shared/schemas/visits'
import { conditionOf, shuntedLampCount, stringStatus } from '../../shared/string-status'
import { typeDefs } from '../../shared/lamp-catalogue'

// CAT-F20: 19 shunted 12 V lamps and one 12 V fuse lamp in series on 230 V (shared/lamp-catalogue.ts).
const catenary = typeDefs.find((t) => t.code === 'CAT-F20')!
const lit = { lampsOut: 0, fuseFailed: false, dark: false, isolated: false }

describe('visit count checks', () => {
  it('counts only the shunted lamps as ones that can be out', () => {
    expect(shuntedLampCount(catenary)).toBe(19)
  })

  it('refuses more lamps out than the string holds, in the words the crew sees', () => {
    expect(countErrors(17, { failedFound: 3, replaced: 0 }, 19)).toEqual({
      failedFound: 'This string has 19 lamps; 17 are already recorded out.',
    })
    expect(countErrors(17, { failedFound: 2, replaced: 0 }, 19)).toEqual({})
  })

  it('refuses replacing more lamps than are out', () => {
    expect(countErrors(2, { failedFound: 1, replaced: 5 }, 19)).toEqual({
      replaced: 'Only 3 lamps are out (2 recorded + 1 found).',
    })
    expect(countErrors(2, { failedFound: 1, replaced: 3 }, 19)).toEqual({})
  })

  it('reports both counts when both are wrong', () => {
    const errors = countErrors(19, { failedFound: 1, replaced: 30 }, 19)
    expect(Object.keys(errors).sort()).toEqual(['failedFound', 'replaced'])
  })
})

describe('relamping without an isolation', () => {
  it('treats a replaced lamp or fuse lamp as relamping, a find-only visit not', () => {
    expect(isRelamping({ replaced: 0, fuseReplaced: false })).toBe(false)
    expect(isRelamping({ replaced: 1 })).toBe(true)
    expect(isRelamping({ replaced: 0, fuseReplaced: true })).toBe(true)
  })

  it('asks for a reason of at least 10 characters', () => {
    const base = { stringId: 1, failedFound: 0, replaced: 1 }
    const short = visitBody.safeParse({ ...base, noIsolationReason: 'Pillar 4.' }) // 9 characters
    expect(short.success).toBe(false)
    expect(short.error!.issues[0].message).toBe('Say why in at least 10 characters.')
    expect(visitBody.safeParse({ ...base, noIsolationReason: 'Pillar 14.' }).success).toBe(true)
  })
})

describe('what a visit does to the recorded condition', () => {
  it('adds found lamps, takes off replaced ones and never goes below none out', () => {
    expect(applyVisit({ ...lit, lampsOut: 2 }, { failedFound: 1, replaced: 0 }).lampsOut).toBe(3)
    expect(applyVisit({ ...lit, lampsOut: 2 }, { failedFound: 0, replaced: 2 }).lampsOut).toBe(0)
  })

  it('lights a dark string with a new fuse lamp and isolates it when left made safe', () => {
    const dark = { ...lit, fuseFailed: true, dark: true }
    expect(applyVisit(dark, { failedFound: 0, replaced: 0, fuseReplaced: true })).toEqual(lit)
    expect(applyVisit(lit, { failedFound: 0, replaced: 0, leaveMadeSafe: true }).isolated).toBe(true)
  })

  it('reads a database row the same as the API record', () => {
    expect(conditionOf({ lampsOut: 1, fuseFailed: 0, dark: 0, isolated: 1 })).toEqual({
      lampsOut: 1,
      fuseFailed: false,
      dark: false,
      isolated: true,
    })
  })

  it('gives the state the server stores after a visit', () => {
    // 2 shorted of 20 × 12 V on 230 V: 230 / (18 × 12) = 1.065 ≥ 1.05 (trade-reference §2–3).
    const after = applyVisit(lit, { failedFound: 2, replaced: 0 })
    expect(stringStatus(catenary, after).status).toBe('replace')
    // 1 shorted: 230 / (19 × 12) = 1.009 < 1.05, so on Watch.
    expect(stringStatus(catenary, applyVisit(after, { failedFound: 0, replaced: 1 })).status).toBe('watch')
  })
})
