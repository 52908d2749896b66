import { describe, expect, it } from 'vitest'
import { ISOLATION_CAUTION, assess } from '../../../shared/engine'
import { assessRequestSchema } from '../../../shared/schemas/engine'

const twelve = (extra: object = {}) => ({ count: 20, ratedVolts: 12, ratedAmps: 0.25, ...extra })
const codes = (r: { reasons: { code: string }[] }) => r.reasons.map((x) => x.code)

describe('assess: where the lamp laws hold', () => {
  // The range is ours: 50 %–140 % of rated voltage (shared/engine/defaults.ts, memory / common
  // practice, no source); Wikipedia "Lamp rerating" states none.
  it('gives a plain verdict and no figures for 19 of 20 shorted (issue 11)', () => {
    // Hand calculation: one 12 V lamp left across 240 V: r = 240 / 12 = 20.
    const r = assess({ supplyVolts: 240, lamps: [twelve({ failed: 19 })] })
    expect(r.maxRatio).toBeCloseTo(20, 9)
    expect(r).toMatchObject({ lit: true, lawsApply: false, replaceNow: true, state: 'replace' })
    expect(r).toMatchObject({ stringAmps: null, stringWatts: null })
    expect(r.classes[0]).toMatchObject({ lifeFactor: null, lightFactor: null, ampsPerLamp: null })
    const high = r.reasons.find((x) => x.code === 'laws_exceeded_high')!
    expect(high.text).toContain('lamps will blow at switch-on or within minutes')
  })

  it('says "little or no light" for 10,000 × 12 V lamps on 230 V, with no life figure (issue 11)', () => {
    // Hand calculation: r = 230 / (10,000 × 12) = 0.0019167.
    const r = assess({ supplyVolts: 230, lamps: [{ count: 10000, ratedVolts: 12, ratedAmps: 0.25 }] })
    expect(r.maxRatio).toBeCloseTo(0.0019167, 6)
    expect(r).toMatchObject({ lawsApply: false, replaceNow: false, stringAmps: null })
    expect(codes(r)).toContain('laws_exceeded_low')
    expect(r.reasons.find((x) => x.code === 'laws_exceeded_low')!.text).toContain('little or no light')
    expect(JSON.stringify(r)).not.toMatch(/e\+|times normal/)
  })

  it('trusts the laws to 140 % and not beyond', () => {
    // Hand calculation: 20 × 12 V on 240 V, 5 shorted: r = 240 / 180 = 1.333; 6 shorted: 240 / 168 = 1.429.
    expect(assess({ supplyVolts: 240, lamps: [twelve({ failed: 5 })] }).lawsApply).toBe(true)
    expect(assess({ supplyVolts: 240, lamps: [twelve({ failed: 6 })] }).lawsApply).toBe(false)
  })
})

describe('assess: chains side by side and open faults', () => {
  it('adds the chains’ currents and puts failures in the first chain', () => {
    // Hand calculation: 2 chains of 20 × 12 V 0.25 A on 240 V, 3 shorted (all in chain 1):
    // chain 1 r = 240 / 204 = 1.176471, I = 0.25 × 1.176471^0.55 = 0.273376 A; chain 2 r = 1, 0.25 A.
    // String 0.523376 A, 240 × 0.523376 = 125.610 W. Lamps lit 17 + 20 = 37.
    const r = assess({ supplyVolts: 240, branches: 2, lamps: [twelve({ failed: 3 })] })
    expect(r.stringAmps).toBeCloseTo(0.523376, 6)
    expect(r.stringWatts).toBeCloseTo(125.61, 2)
    expect(r.classes[0]).toMatchObject({ lampsLit: 37 })
    expect(r.classes[0].ratio).toBeCloseTo(1.176471, 6)
    expect(r.branchesDark).toBe(0)
  })

  it('darkens a chain with a lamp missing and says the sockets are live', () => {
    // trade-reference §2a: a lamp removed from its socket opens the chain; the sockets sit at
    // neutral and full supply voltage. Hand: the other chain carries 0.25 A at r = 1.
    const r = assess({ supplyVolts: 240, branches: 2, lamps: [twelve({ removed: 1 })] })
    expect(r).toMatchObject({ lit: true, branchesDark: 1, replaceNow: true, state: 'replace' })
    expect(r.stringAmps).toBeCloseTo(0.25, 9)
    const removed = r.reasons.find((x) => x.code === 'lamp_removed')!
    expect(removed.text).toContain('1 of 2 chains is dark')
    expect(removed.text).toContain(ISOLATION_CAUTION)
  })

  it('puts a single chain out when a failed lamp’s shunt stayed open', () => {
    // trade-reference §2: a failed lamp whose shunt does not close puts the whole string out.
    const r = assess({ supplyVolts: 240, lamps: [twelve({ opened: 1 })] })
    expect(r).toMatchObject({ lit: false, state: 'dark', replaceNow: true, stringAmps: 0, stringWatts: 0 })
    expect(r.reasons[0]).toMatchObject({
      code: 'chain_open',
      text: expect.stringContaining(ISOLATION_CAUTION),
    })
  })

  it('keeps the other chains lit when one chain’s fuse lamp fails', () => {
    const r = assess({
      supplyVolts: 240,
      branches: 3,
      lamps: [
        { count: 19, ratedVolts: 12, ratedAmps: 0.25 },
        { count: 1, ratedVolts: 12, ratedAmps: 0.25, shunted: false, failed: 1 },
      ],
    })
    expect(r).toMatchObject({ lit: true, branchesDark: 1, state: 'replace' })
    expect(r.reasons[0].code).toBe('fuse_lamp_failed')
    expect(r.reasons[0].text).toContain('1 of 3 chains is dark; the other 2 stay lit')
    // Hand: two intact chains at r = 1, 0.25 A each.
    expect(r.stringAmps).toBeCloseTo(0.5, 9)
  })

  it('refuses more failures than the string holds, naming the field', () => {
    const body = (failed: number) => ({ supplyVolts: 240, branches: 2, lamps: [twelve({ failed })] })
    expect(assessRequestSchema.safeParse(body(40)).success).toBe(true)
    const bad = assessRequestSchema.safeParse(body(41))
    expect(bad.success).toBe(false)
    expect(bad.error!.issues[0].path).toEqual(['lamps', 0, 'failed'])
  })
})

describe('assess: LED strings', () => {
  const motif = (supplyVolts: number, extra: object = {}) =>
    assess({
      supplyVolts,
      technology: 'led',
      wiring: 'parallel',
      powerFactor: 0.9,
      lamps: [{ count: 12, ratedVolts: 230, ratedAmps: 0.01, shunted: false }],
      ...extra,
    })

  it('keeps a 230 V motif at 245 V in range: no "replace now", no "life 44 %" (issue 11)', () => {
    // EN 50160: 230 V ± 10 % = 207–253 V holds 245 V. Filament physics would say 1.0652^−13 = 0.44.
    // Hand calculation, constant power: I = 12 × 230 × 0.01 / 245 = 0.112653 A;
    // W = 245 × 0.112653 × 0.9 = 24.84 W (= 12 × 2.3 W × 0.9).
    const r = motif(245)
    expect(r).toMatchObject({ technology: 'led', state: 'lit', replaceNow: false, lawsApply: false })
    expect(codes(r)).toEqual(['led_in_range'])
    expect(r.stringAmps).toBeCloseTo(0.112653, 6)
    expect(r.stringWatts).toBeCloseTo(24.84, 9)
    expect(r.classes[0].lifeFactor).toBeNull()
    expect(JSON.stringify(r.reasons)).not.toMatch(/44 %|of normal|replace/i)
  })

  it('flags a supply outside the driver range', () => {
    // 260 V > 253 V (230 V + 10 %, EN 50160); a stated 200–250 V range holds 245 V but not 199 V.
    expect(motif(260)).toMatchObject({ replaceNow: true, state: 'replace' })
    expect(codes(motif(260))).toContain('led_out_of_range')
    expect(motif(245, { driverMinVolts: 200, driverMaxVolts: 250 }).state).toBe('lit')
    expect(motif(199, { driverMinVolts: 200, driverMaxVolts: 250 })).toMatchObject({
      state: 'watch',
      replaceNow: false,
    })
  })

  it('puts a series LED chain out when a section fails, and only that chain', () => {
    // Hand calculation: 10 × 23 V 0.02 A sections per chain on 230 V: one lit chain draws
    // 10 × 23 × 0.02 / 230 = 0.02 A.
    const r = assess({
      supplyVolts: 230,
      technology: 'led',
      branches: 2,
      lamps: [{ count: 10, ratedVolts: 23, ratedAmps: 0.02, failed: 1 }],
    })
    expect(r).toMatchObject({ lit: true, branchesDark: 1, state: 'replace' })
    expect(codes(r)).toContain('led_section_out')
    expect(r.stringAmps).toBeCloseTo(0.02, 9)
  })
})
