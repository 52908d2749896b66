import { describe, expect, it } from 'vitest'
import { assess } from '../../shared/engine'
import { assessResponseSchema } from '../../shared/schemas/engine'
import { queueKindLabel, queueKinds, stringStatusKind } from '../../shared/schemas/queue'
import { engineStates, statusLabel, statusSchema, statuses } from '../../shared/schemas/string-states'
import { engineInput, stringStatus } from '../../shared/string-status'
import { typeDefs } from '../../shared/lamp-catalogue'

const catenary = typeDefs.find((t) => t.code === 'CAT-F20')!
const recorded = (lampsOut: number, extra = {}) => ({
  lampsOut,
  fuseFailed: false,
  dark: false,
  isolated: false,
  ...extra,
})

describe('one name per string state', () => {
  it('spells the engine verdict as the string record does', () => {
    // 2 shorted of 20 × 12 V on 230 V: 230 / (18 × 12) = 1.065 ≥ 1.05 (trade-reference §2–3).
    const cases: [number, object, string][] = [
      [0, {}, 'lit'],
      [1, {}, 'watch'],
      [2, {}, 'replace'],
      [0, { fuseFailed: true }, 'dark'],
    ]
    for (const [out, extra, word] of cases) {
      const c = recorded(out, extra)
      expect(assess(engineInput(catenary, c)).state).toBe(word)
      expect(stringStatus(catenary, c).status).toBe(word)
    }
  })

  it('has a made-safe state only the record gives, never the engine', () => {
    expect(stringStatus(catenary, recorded(2, { isolated: true })).status).toBe('safe')
    expect(statuses).toEqual(['lit', 'watch', 'replace', 'dark', 'safe'])
    expect(engineStates).toEqual(['lit', 'watch', 'replace', 'dark'])
    expect(assessResponseSchema.shape.state.options).toEqual(engineStates)
    for (const s of engineStates) expect(statusSchema.parse(s)).toBe(s)
    expect(statusSchema.safeParse('replace-now').success).toBe(false)
  })

  it('names each state once, in the words of the product brief ("Words")', () => {
    expect(statusLabel).toEqual({
      lit: 'Lit',
      watch: 'Watch',
      replace: 'Replace now',
      dark: 'Dark',
      safe: 'Made safe',
    })
    expect(queueKindLabel.replace_now).toBe('Replace now')
  })

  it('opens a queue item of its own kind for a replace-now or dark string only', () => {
    expect(stringStatusKind).toEqual({ replace: 'replace_now', dark: 'dark' })
    for (const kind of Object.values(stringStatusKind)) expect(queueKinds).toContain(kind)
  })
})
