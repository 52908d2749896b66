import { describe, expect, it } from 'vitest'
import { assess } from '../../../shared/engine'

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

  it('applies the current, power and light laws to string amps and watts', () => {
    // Fink & Beaty via Wikipedia "Lamp rerating": I ∝ r^0.55, P ∝ r^1.6, light ∝ r^3.4.
    const r = assess({ supplyVolts: 240, lamps: [twelveVolt(3)] })
    const ratio = 240 / (12 * 17)
    expect(r.stringAmps).toBeCloseTo(0.25 * ratio ** 0.55, 9)
    expect(r.stringWatts).toBeCloseTo(17 * 12 * 0.25 * ratio ** 1.6, 9)
    expect(r.classes[0].lightFactor).toBeCloseTo(ratio ** 3.4, 9)
  })
})

describe('assess: replace now and dark strings', () => {
  it('says in plain words what one shorted lamp does to the rest', () => {
    // Wording asked for by the engine brief; 5 % over-voltage ≈ halves life (Lamptech; Hella).
    const r = assess({ supplyVolts: 240, lamps: [twelveVolt(1)] })
    expect(r.reasons[0]).toBe(
      '1 lamp shorted: the other 19 run at 105 % of rating; expected life about half of normal.',
    )
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
    expect(r.reasons[0]).toMatch(/fuse lamp/)
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
    expect(r.reasons[1]).toMatch(/check the supply voltage/)
  })
})
