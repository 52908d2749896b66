import { describe, expect, it } from 'vitest'
import { ISOLATION_CAUTION, assess } from '../../../shared/engine'

const twelveVolt = (failed: number) => ({ count: 20, ratedVolts: 12, ratedAmps: 0.25, failed })
const mini = (failed: number) => ({ count: 50, ratedVolts: 2.5, ratedAmps: 0.17, failed })

describe('assess: voltage share and life factors', () => {
  // Check values: trade-reference §3 "Computed check values" table (life factor for d = 12 / d = 16),
  // built on the share rule of §2 (common practice) and life ∝ r^−d (Fink & Beaty via Wikipedia
  // "Lamp rerating").
  const table = [
    { lamps: twelveVolt(1), supply: 240, volts: 12.632, d12: 0.54, d16: 0.44, digits: 3 },
    { lamps: twelveVolt(2), supply: 240, volts: 13.333, d12: 0.282, d16: 0.185, digits: 3 },
    { lamps: twelveVolt(3), supply: 240, volts: 14.118, d12: 0.142, d16: 0.074, digits: 3 },
    { lamps: mini(0), supply: 120, volts: 2.4, d12: 1.63, d16: 1.92, digits: 2 },
    { lamps: mini(5), supply: 120, volts: 2.667, d12: 0.461, d16: 0.356, digits: 3 },
  ]
  for (const row of table) {
    it(`${row.lamps.count} × ${row.lamps.ratedVolts} V on ${row.supply} V with ${row.lamps.failed} shorted`, () => {
      const at12 = assess({ supplyVolts: row.supply, lamps: [row.lamps], lifeExponent: 12 })
      const at16 = assess({ supplyVolts: row.supply, lamps: [row.lamps], lifeExponent: 16 })
      expect(at12.classes[0].voltsPerLamp).toBeCloseTo(row.volts, 3)
      expect(at12.classes[0].lifeFactor).toBeCloseTo(row.d12, row.digits)
      expect(at16.classes[0].lifeFactor).toBeCloseTo(row.d16, row.digits)
    })
  }

  it('shares the supply in proportion to rated voltage across mixed ratings', () => {
    // trade-reference §2 (common practice): V_i = V_supply · V_rated,i / Σ V_rated in circuit.
    // 18 × 12 V + 1 × 6 V on 240 V: Σ = 222 V, so 12 V lamps get 240·12/222 and the 6 V lamp half that.
    const r = assess({
      supplyVolts: 240,
      lamps: [
        { count: 19, ratedVolts: 12, ratedAmps: 0.25, failed: 1 },
        { count: 1, ratedVolts: 6, ratedAmps: 0.25, shunted: false },
      ],
    })
    expect(r.classes[0].voltsPerLamp).toBeCloseTo((240 * 12) / 222, 9)
    expect(r.classes[1].voltsPerLamp).toBeCloseTo((240 * 6) / 222, 9)
    expect(r.classes[1].ratio).toBeCloseTo(r.classes[0].ratio, 12)
  })

  it('gives string watts as volts × amps exactly, with the current law for the amps', () => {
    // Fink & Beaty via Wikipedia "Lamp rerating": I ∝ r^0.55, light ∝ r^3.4. Hand calculation:
    // 20 × 12 V 0.25 A on 240 V, 3 shorted: r = 240 / (17 × 12) = 1.176471;
    // I = 0.25 × 1.176471^0.55 = 0.25 × exp(0.55 × 0.162519) = 0.25 × 1.093502 = 0.273376 A;
    // W = 240 × 0.273376 = 65.610 W.
    const r = assess({ supplyVolts: 240, lamps: [twelveVolt(3)] })
    expect(r.stringVolts).toBe(240)
    expect(r.stringAmps).toBeCloseTo(0.273376, 6)
    expect(r.stringWatts).toBeCloseTo(65.61, 2)
    expect(r.stringWatts).toBe(240 * r.stringAmps!)
    expect(r.classes[0].ampsPerLamp).toBeCloseTo(0.273376, 6)
    expect(r.classes[0].wattsPerLamp).toBeCloseTo(14.118 * 0.273376, 3)
    expect(r.classes[0].lightFactor).toBeCloseTo(1.176471 ** 3.4, 5)
  })

  it('shows 240 V × 0.0660 A as 15.83 W, not the 15.97 W of summing r^1.6 per lamp (issue 11)', () => {
    // Hand calculation: 20 lamps of 0.06 A in circuit rated 202 V in all (19 × 10 V + 1 × 12 V) on
    // 240 V: r = 240 / 202 = 1.188119; I = 0.06 × 1.188119^0.55 = 0.065967 A; V × I = 15.832 W.
    // The old sum Σ V_rated · I_rated · r^1.6 = 202 × 0.06 × 1.188119^1.6 = 15.969 W.
    const r = assess({
      supplyVolts: 240,
      lamps: [
        { count: 19, ratedVolts: 10, ratedAmps: 0.06 },
        { count: 1, ratedVolts: 12, ratedAmps: 0.06, shunted: false },
      ],
    })
    expect(r.stringAmps).toBeCloseTo(0.065967, 6)
    expect(r.stringWatts).toBeCloseTo(15.832, 3)
  })

  it('solves the current of a chain with one wrong lamp and flags it (issue 11, mixed ratings)', () => {
    // Hand calculation, one current through the chain, each lamp's V from I = I_rated · r^0.55:
    // k = 1 / 0.55 = 1.818182; 0.25^k = 0.080417, 0.17^k = 0.039886;
    // S = Σ n · V_rated / I_rated^k = 19 × 12 / 0.080417 + 12 / 0.039886 = 2835.22 + 300.86 = 3136.10;
    // r_i = V / (S · I_i^k): 0.25 A lamps 240 / (3136.10 × 0.080417) = 0.9516,
    // the 0.17 A lamp 240 / (3136.10 × 0.039886) = 1.9187 — near 192 % of its rating, and will blow.
    const r = assess({
      supplyVolts: 240,
      lamps: [
        { count: 19, ratedVolts: 12, ratedAmps: 0.25 },
        { count: 1, ratedVolts: 12, ratedAmps: 0.17 },
      ],
    })
    expect(r.classes[0].ratio).toBeCloseTo(0.9516, 4)
    expect(r.classes[1].ratio).toBeCloseTo(1.9187, 4)
    expect(r.maxRatio).toBeCloseTo(1.9187, 4)
    expect(r).toMatchObject({ replaceNow: true, state: 'replace', lawsApply: false, stringAmps: null })
    const codes = r.reasons.map((x) => x.code)
    expect(codes).toContain('mixed_rating')
    expect(codes).toContain('laws_exceeded_high')
    expect(r.reasons.find((x) => x.code === 'mixed_rating')!.text).toMatch(/12 V 0\.17 A lamp runs at 192 %/)
    expect(r.classes[1].lifeFactor).toBeNull()
  })
})

describe('assess: replace now and dark strings', () => {
  it('says in plain words what one shorted lamp does to the rest', () => {
    // Wording asked for by the engine brief; 5 % over-voltage ≈ halves life (Lamptech; Hella).
    const r = assess({ supplyVolts: 240, lamps: [twelveVolt(1)] })
    expect(r.reasons[0]).toEqual({
      code: 'lamps_shorted',
      text: '1 lamp shorted: the other 19 run at 105 % of rating; expected life about half of normal.',
    })
    expect(r.replaceNow).toBe(true)
    expect(r.state).toBe('replace')
  })

  it('keeps a string below the limit on Watch and a full string at rating Lit', () => {
    const watch = assess({ supplyVolts: 120, lamps: [mini(1)] })
    expect(watch.maxRatio).toBeLessThan(1.05)
    expect(watch.state).toBe('watch')
    expect(watch.replaceNow).toBe(false)
    expect(assess({ supplyVolts: 240, lamps: [twelveVolt(0)] }).state).toBe('lit')
  })

  it('puts the string out when a fuse lamp has failed', () => {
    // trade-reference §2: a fuse lamp has no shunt; when it fails the whole string goes out.
    const r = assess({
      supplyVolts: 240,
      lamps: [
        { count: 19, ratedVolts: 12, ratedAmps: 0.25, failed: 2 },
        { count: 1, ratedVolts: 12, ratedAmps: 0.25, shunted: false, failed: 1 },
      ],
    })
    expect(r).toMatchObject({ lit: false, state: 'dark', replaceNow: true, stringAmps: 0, stringWatts: 0 })
    expect(r.classes.map((c) => c.ratio)).toEqual([0, 0])
    expect(r.reasons[0].code).toBe('fuse_lamp_failed')
    expect(r.reasons[0].text).toMatch(/fuse lamp/)
    // trade-reference §2 caution: the failed lamp's socket sits at full supply voltage.
    expect(r.reasons[0].text).toContain(ISOLATION_CAUTION)
  })

  it('is dark when every lamp has failed', () => {
    const r = assess({ supplyVolts: 240, lamps: [twelveVolt(20)] })
    expect(r.lit).toBe(false)
    expect(r.maxRatio).toBe(0)
  })

  it('does not raise the stress on the rest of a parallel string', () => {
    const r = assess({
      supplyVolts: 230,
      wiring: 'parallel',
      lamps: [{ count: 12, ratedVolts: 230, ratedAmps: 0.01, failed: 4, shunted: false }],
    })
    expect(r.lit).toBe(true)
    expect(r.maxRatio).toBe(1)
    expect(r.state).toBe('watch')
    expect(r.stringAmps).toBeCloseTo(8 * 0.01, 12)
  })

  it('flags an over-volted supply even with no lamp out', () => {
    // 19 × 12 V on 240 V: every lamp at 105 %, the replace-now limit (Lamptech: 5 % ≈ half life).
    const r = assess({ supplyVolts: 240, lamps: [{ count: 19, ratedVolts: 12, ratedAmps: 0.25 }] })
    expect(r.replaceNow).toBe(true)
    expect(r.reasons[1]).toMatchObject({
      code: 'supply_high',
      text: expect.stringMatching(/check the supply voltage/),
    })
  })
})
