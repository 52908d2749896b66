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

const near = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b))

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

  it('runs every lamp at ratio 1 when the supply equals the sum of ratings and none failed', () => {
    fc.assert(
      fc.property(classes, (lamps) => {
        const supply = lamps.reduce((s, c) => s + c.count * c.ratedVolts, 0)
        const r = assess({ supplyVolts: supply, lamps })
        r.classes.forEach((c) => expect(near(c.ratio, 1)).toBe(true))
        expect(r.state).toBe('lit')
      }),
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
