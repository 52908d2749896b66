import { describe, expect, it } from 'vitest'
import { assess } from '../../shared/engine'
import { assessResponseSchema } from '../../shared/schemas/engine'
import { queueKindLabel, queueKinds, stringStatusKind } from '../../shared/vocab/queue'
import { statusSchema } from '../../shared/schemas/string-states'
import { engineStates, statusLabel, statuses } from '../../shared/vocab/string-states'
import {
  engineInput,
  exposureAfter,
  forecastInput,
  shuntedLampCount,
  stringStatus,
} from '../../shared/string-status'
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
    // CAT-F20: 19 × 12 V lamps and an 11 V fuse lamp at the same current on 230 V (trade-reference
    // §2–3: the supply shared in proportion to rated volts). 1 shorted: 230 / (18 × 12 + 11) = 1.013
    // < 1.05, watch; 2 shorted: 230 / (17 × 12 + 11) = 230 / 215 = 1.070 ≥ 1.05, replace now.
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

describe('a string type as the engine takes it', () => {
  const ledCurtain = typeDefs.find((t) => t.code === 'CUR-L')!

  it('carries the type data the engine asks for, by its agreed names', () => {
    const req = engineInput({ ...ledCurtain, branches: 2 }, recorded(0)) as Record<string, unknown>
    expect(req).toMatchObject({ technology: 'led', branches: 2, driverMinVolts: 180, driverMaxVolts: 264 })
    expect(req.powerFactor).toBe(0.55)
    // Each of the two chains holds every class once: 2 × 40 LED drops can be out.
    expect(shuntedLampCount({ ...ledCurtain, branches: 2 })).toBe(80)
  })

  it("starts the forecast from each class's exposure, with a class's own life settings", () => {
    const req = forecastInput(catenary, recorded(0), {
      lampAgeHours: 900,
      exposure: [600, 450],
      burnHoursPerDay: 7,
      startDate: '2026-12-02',
      trials: 10,
      seed: 1,
    })
    expect(req.lamps.map((l) => l.ageHours)).toEqual([600, 450])
    expect((req.lamps[1] as { lifeExponent?: number }).lifeExponent).toBe(16) // the fuse lamp's own
    expect((req.lamps[0] as { lifeExponent?: number }).lifeExponent).toBeUndefined() // the type's
    expect(req.lampAgeHours).toBeUndefined() // every class has its own age
  })

  it('adds exposure at h × r^d per class, and nothing while dark or made safe', () => {
    // CAT-F20 intact on 230 V: r = 230 / (19 × 12 + 11) = 230 / 239 = 0.962343; ln r = −0.0383842.
    //   lamps d = 13: e^(13 × −0.0383842) = e^−0.498995 = 0.607140 → 100 h adds 60.71 h
    //   fuse lamp d = 16: e^(16 × −0.0383842) = e^−0.614148 = 0.541102 → 100 h adds 54.11 h
    const e = exposureAfter(catenary, recorded(0), [1000, 1000], 100)
    expect(e[0]).toBeCloseTo(1060.71, 1)
    expect(e[1]).toBeCloseTo(1054.11, 1)
    expect(exposureAfter(catenary, recorded(0, { isolated: true }), [1000, 1000], 100)).toEqual([1000, 1000])
    expect(exposureAfter(catenary, recorded(0, { fuseFailed: true }), [1000, 1000], 100)).toEqual([
      1000, 1000,
    ])
    // An LED type ages by plain hours (its driver holds the current): 100 h adds 100 h.
    expect(exposureAfter(ledCurtain, recorded(0), [5], 100)).toEqual([105])
  })
})
