// What a string uses from a van's stock, by lamp class, and when a count is low. The server's visit
// consumption, the planner's warning and the load-out sheet all count with these, so a lamp fitted
// and a lamp forecast are the same item.
import type { ClassSpec } from './string-status'

/** A lamp class as a stock item: one item per rating and shunt, whichever string types use it. */
export function lampKey(c: Pick<ClassSpec, 'ratedVolts' | 'ratedAmps' | 'shunted'>): string {
  return `lamp:${+c.ratedVolts}V:${+c.ratedAmps}A:${c.shunted ? 's' : 'u'}`
}

/** The item's name in lists: the class label and its rating, e.g. "Fuse lamp 11 V 0.5 A". */
export function lampItemName(c: Pick<ClassSpec, 'ratedVolts' | 'ratedAmps'> & { label: string }): string {
  return `${c.label} ${+c.ratedVolts} V ${+c.ratedAmps} A`
}

export interface LampUse {
  /** Ordinary (shunted) lamps: fitted on a visit, or out on a string. */
  lamps: number
  /** The fuse lamp: replaced on a visit, or failed on a string. */
  fuse: boolean
}

/**
 * Lamps by class index, the way the records count them (shared/string-status.ts `engineInput`):
 * ordinary lamps fill the shunted classes in order, each holding `count` × chains; a type with no
 * shunted class (LED) counts them against its classes in order. The fuse lamp is the first unshunted
 * class of a type that has shunted ones.
 */
export function lampsByClass(
  type: { classes: Pick<ClassSpec, 'count' | 'shunted'>[]; branches?: number | null },
  use: LampUse,
): { classIndex: number; quantity: number }[] {
  const chains = Math.max(1, type.branches ?? 1)
  const anyShunted = type.classes.some((k) => k.shunted)
  const lampClasses = type.classes.map((k, i) => ({ k, i })).filter(({ k }) => k.shunted || !anyShunted)
  const out = new Map<number, number>()
  let left = use.lamps
  lampClasses.forEach(({ k, i }, n) => {
    const last = n === lampClasses.length - 1
    const take = last ? left : Math.min(left, k.count * chains)
    if (take > 0) out.set(i, take)
    left -= take
  })
  if (use.fuse && anyShunted) {
    const fuse = type.classes.findIndex((k) => !k.shunted)
    if (fuse >= 0) out.set(fuse, (out.get(fuse) ?? 0) + 1)
  }
  return [...out].map(([classIndex, quantity]) => ({ classIndex, quantity }))
}

/** Low: at or below its level, or below zero (a van's count can be wrong; lamps fitted are still recorded). */
export function isLow(quantity: number, lowAt: number | null): boolean {
  return quantity < 0 || (lowAt !== null && quantity <= lowAt)
}

/** A notice goes out once per crossing: when a change takes a count from not low to low. */
export function crossesLow(before: number, after: number, lowAt: number | null): boolean {
  return !isLow(before, lowAt) && isLow(after, lowAt)
}

export interface NeedLine {
  itemId: number
  itemName: string
  need: number
  have: number
  short: number
}

/** Forecast use against stock, one line per item needed; `short` is what the stock cannot cover. */
export function needLines(
  need: Map<number, { itemName: string; quantity: number }>,
  have: Map<number, number>,
): NeedLine[] {
  return [...need]
    .map(([itemId, n]) => {
      const h = have.get(itemId) ?? 0
      return {
        itemId,
        itemName: n.itemName,
        need: n.quantity,
        have: h,
        short: Math.max(0, n.quantity - Math.max(0, h)),
      }
    })
    .sort((a, b) => b.short - a.short || a.itemName.localeCompare(b.itemName))
}

export interface OrderLine {
  itemId: number
  itemName: string
  /** Fitted over the period. */
  used: number
  /** Known to be needed before the strings go up again (lamps out, repairs, take-down records). */
  needed: number
  /** On hand now, depot and vans together (counts below zero count as none). */
  inStock: number
  order: number
}

/** Next season's order: what the season used plus what is known to be needed, less what is on hand. */
export function orderLines(
  items: { itemId: number; itemName: string }[],
  used: Map<number, number>,
  needed: Map<number, number>,
  inStock: Map<number, number>,
): OrderLine[] {
  return items
    .map(({ itemId, itemName }) => {
      const u = used.get(itemId) ?? 0
      const n = needed.get(itemId) ?? 0
      const s = Math.max(0, inStock.get(itemId) ?? 0)
      return { itemId, itemName, used: u, needed: n, inStock: s, order: Math.max(0, u + n - s) }
    })
    .filter((l) => l.used || l.needed || l.order)
    .sort((a, b) => b.order - a.order || a.itemName.localeCompare(b.itemName))
}
