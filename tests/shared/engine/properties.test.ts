import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { assess, lampFactors } from '../../../shared/engine'

const lampClass = fc.record({
  count: fc.integer({ min: 1, max: 60 }),
  ratedVolts: fc.double({ min: 1, max: 250, noNaN: true }),
  ratedAmps: fc.double({ min: 0.01, max: 2, noNaN: true }),
  failed: fc.constant(0),
  shunted: fc.constant(true),
})
const classes = fc.array(lampClass, { minLength: 1, maxLength: 4 })
const wiring = fc.constantFrom('series' as const, 'parallel' as const)
const lifeExponent = fc.double({ min: 12, max: 16, noNaN: true })

const near = (a: number | null, b: number | null) =>
  a === null || b === null ? a === b : Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b))

describe('assess properties', () => {
  it('never lowers any ratio when one more lamp shorts', () => {
    fc.assert(
      fc.property(
        classes,
        fc.nat(),
        fc.double({ min: 10, max: 400, noNaN: true }),
        wiring,
        (lamps, pick, supply, w) => {
          const before = lamps.map((c, i) => ({ ...c, failed: i === 0 ? Math.floor(c.count / 3) : 0 }))
          const at = pick % lamps.length
          fc.pre(before[at].failed < before[at].count - 1)
          const after = before.map((c, i) => (i === at ? { ...c, failed: c.failed + 1 } : c))
          const a = assess({ supplyVolts: supply, lamps: before, wiring: w })
          const b = assess({ supplyVolts: supply, lamps: after, wiring: w })
          b.classes.forEach((c, i) =>
            expect(c.ratio).toBeGreaterThanOrEqual(a.classes[i].ratio * (1 - 1e-12)),
          )
        },
      ),
    )
  })

  it('runs every lamp at ratio 1 when one rated current runs through and the supply equals the sum of ratings', () => {
    // trade-reference §2: equal rated currents share the supply in proportion to rated voltage.
    const oneCurrent = fc
      .tuple(classes, fc.double({ min: 0.01, max: 2, noNaN: true }))
      .map(([ls, a]) => ls.map((c) => ({ ...c, ratedAmps: a })))
    fc.assert(
      fc.property(oneCurrent, (lamps) => {
        const supply = lamps.reduce((s, c) => s + c.count * c.ratedVolts, 0)
        const r = assess({ supplyVolts: supply, lamps })
        r.classes.forEach((c) => expect(near(c.ratio, 1)).toBe(true))
        expect(r.state).toBe('lit')
      }),
    )
  })

  it('makes a series chain obey Kirchhoff: the lamps’ volts add up to the supply, one current flows', () => {
    // Series circuit laws; each class's current from its own law I = I_rated · r^0.55 (Fink & Beaty).
    fc.assert(
      fc.property(classes, fc.double({ min: 10, max: 400, noNaN: true }), (lamps, supply) => {
        const r = assess({ supplyVolts: supply, lamps })
        const volts = r.classes.reduce((s, c, i) => s + lamps[i].count * c.voltsPerLamp, 0)
        expect(near(volts, supply)).toBe(true)
        const currents = r.classes.map((c, i) => lamps[i].ratedAmps * c.ratio ** 0.55)
        currents.forEach((a) => expect(near(a, currents[0])).toBe(true))
      }),
    )
  })

  it('gives string watts = volts × amps × power factor whenever it gives them', () => {
    const tech = fc.constantFrom('filament' as const, 'led' as const)
    const pf = fc.double({ min: 0.3, max: 1, noNaN: true })
    fc.assert(
      fc.property(
        classes,
        fc.double({ min: 10, max: 400, noNaN: true }),
        wiring,
        tech,
        pf,
        fc.integer({ min: 1, max: 4 }),
        (lamps, supply, w, t, p, m) => {
          const r = assess({
            supplyVolts: supply,
            lamps,
            wiring: w,
            technology: t,
            powerFactor: p,
            branches: m,
          })
          if (r.stringAmps === null) expect(r.stringWatts).toBeNull()
          else expect(r.stringWatts).toBe(r.stringVolts * r.stringAmps * r.powerFactor)
        },
      ),
    )
  })

  it('lets life fall as the ratio rises', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 2, noNaN: true }),
        fc.double({ min: 0.001, max: 0.5, noNaN: true }),
        lifeExponent,
        (r, step, d) => {
          expect(lampFactors(r + step, d).lifeFactor).toBeLessThan(lampFactors(r, d).lifeFactor)
        },
      ),
    )
  })

  it('gives the same string result whatever the order of the classes', () => {
    const withFailures = fc.array(
      fc.tuple(lampClass, fc.nat(), fc.boolean(), fc.integer()).map(([c, f, shunted, key]) => ({
        lamp: { ...c, failed: f % (c.count + 1), shunted },
        key,
      })),
      { minLength: 1, maxLength: 5 },
    )
    fc.assert(
      fc.property(withFailures, fc.double({ min: 10, max: 400, noNaN: true }), wiring, (items, supply, w) => {
        const order = items.map((_, i) => i).sort((x, y) => items[x].key - items[y].key)
        const a = assess({ supplyVolts: supply, lamps: items.map((x) => x.lamp), wiring: w })
        const b = assess({ supplyVolts: supply, lamps: order.map((i) => items[i].lamp), wiring: w })
        expect([b.lit, b.state, b.replaceNow]).toEqual([a.lit, a.state, a.replaceNow])
        expect(near(b.stringAmps, a.stringAmps) && near(b.stringWatts, a.stringWatts)).toBe(true)
        expect(near(b.maxRatio, a.maxRatio)).toBe(true)
        order.forEach((i, j) => expect(near(b.classes[j].ratio, a.classes[i].ratio)).toBe(true))
      }),
    )
  })
})
