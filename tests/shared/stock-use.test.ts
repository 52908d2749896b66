// Stock counting by lamp class. Types from the demo catalogue (shared/lamp-catalogue.ts): CAT-F20 is
// 19 shunted lamps + 1 unshunted fuse lamp, MOT-L 12 LED modules with no shunt. Expected counts are
// worked by hand.
import { describe, expect, it } from 'vitest'
import { crossesLow, isLow, lampKey, lampsByClass, needLines, orderLines } from '../../shared/stock-use'

const catenary = {
  classes: [
    { count: 19, shunted: true },
    { count: 1, shunted: false },
  ],
}
const motif = { classes: [{ count: 12, shunted: false }] }

describe('stock use', () => {
  it('counts ordinary lamps against the shunted class and the fuse lamp against the unshunted one', () => {
    expect(lampsByClass(catenary, { lamps: 3, fuse: false })).toEqual([{ classIndex: 0, quantity: 3 }])
    expect(lampsByClass(catenary, { lamps: 3, fuse: true })).toEqual([
      { classIndex: 0, quantity: 3 },
      { classIndex: 1, quantity: 1 },
    ])
    expect(lampsByClass(catenary, { lamps: 0, fuse: false })).toEqual([])
  })

  it('counts LED modules against the type’s class when no class has a shunt', () => {
    expect(lampsByClass(motif, { lamps: 2, fuse: true })).toEqual([{ classIndex: 0, quantity: 2 }])
  })

  it('fills two shunted classes in order, each holding count × chains', () => {
    const two = {
      classes: [
        { count: 5, shunted: true },
        { count: 10, shunted: true },
      ],
      branches: 2,
    }
    // 12 out: 10 in the first class (5 × 2 chains), 2 in the second.
    expect(lampsByClass(two, { lamps: 12, fuse: false })).toEqual([
      { classIndex: 0, quantity: 10 },
      { classIndex: 1, quantity: 2 },
    ])
  })

  it('keys a lamp by its rating, so two types with the same lamp share stock', () => {
    expect(lampKey({ ratedVolts: 12, ratedAmps: 0.5, shunted: true })).toBe('lamp:12V:0.5A:s')
    expect(lampKey({ ratedVolts: 11, ratedAmps: 0.5, shunted: false })).toBe('lamp:11V:0.5A:u')
  })

  it('is low at or below its level or below zero, and notifies only on the crossing', () => {
    expect(isLow(5, 5)).toBe(true)
    expect(isLow(6, 5)).toBe(false)
    expect(isLow(-1, null)).toBe(true)
    expect(isLow(0, null)).toBe(false)
    expect(crossesLow(6, 5, 5)).toBe(true)
    expect(crossesLow(5, 4, 5)).toBe(false)
    expect(crossesLow(1, -1, null)).toBe(true)
  })

  it('shows a shortfall only for what the van cannot cover', () => {
    const need = new Map([
      [1, { itemName: 'Lamp', quantity: 3 }],
      [2, { itemName: 'Fuse lamp', quantity: 1 }],
    ])
    expect(
      needLines(
        need,
        new Map([
          [1, 1],
          [2, 4],
        ]),
      ),
    ).toEqual([
      { itemId: 1, itemName: 'Lamp', need: 3, have: 1, short: 2 },
      { itemId: 2, itemName: 'Fuse lamp', need: 1, have: 4, short: 0 },
    ])
  })

  it('orders use plus known needs less what is on hand, never below zero', () => {
    const items = [
      { itemId: 1, itemName: 'Lamp' },
      { itemId: 2, itemName: 'Fuse lamp' },
    ]
    const lines = orderLines(
      items,
      new Map([
        [1, 120],
        [2, 4],
      ]),
      new Map([[1, 30]]),
      new Map([
        [1, 100],
        [2, 10],
      ]),
    )
    // Lamp: 120 + 30 − 100 = 50. Fuse lamp: 4 − 10 → 0.
    expect(lines.map((l) => [l.itemName, l.order])).toEqual([
      ['Lamp', 50],
      ['Fuse lamp', 0],
    ])
  })
})
