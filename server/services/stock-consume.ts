// Lamps fitted on a visit come off the fitter's crew van, by lamp class of the string's type, in the
// visit's own transaction: a replayed visit (same Idempotency-Key) never reaches here, so it takes
// nothing again. The count may go below zero: what was fitted is recorded even when the van's count
// was wrong, and the low-stock notice asks for a recount.
import type { Db } from '../db'
import { lampsByClass } from '../../shared/stock-use'
import type { ClassSpec } from '../../shared/string-status'
import { lampItemId, vanOf } from './stock-places'
import { changeLevel } from './stock-levels'

export interface Fitting {
  visitId: number
  userId: number
  /** The fitter's crew; none (a supervisor on no crew): the use is recorded against no van. */
  crewId: number | null
  stringId: number
  clientId: number | null
  type: { classes: (ClassSpec & { label: string })[]; branches?: number | null }
  lamps: number
  fuse: boolean
  at: Date
}

/** Takes what a visit fitted from the crew's van and records it; returns the items and quantities. */
export async function consumeFitted(trx: Db, f: Fitting) {
  const uses = lampsByClass(f.type, { lamps: f.lamps, fuse: f.fuse })
  if (!uses.length) return []
  const van = f.crewId ? await vanOf(trx, f.crewId) : null
  const taken: { itemId: number; quantity: number }[] = []
  for (const u of uses) {
    const itemId = await lampItemId(trx, f.type.classes[u.classIndex])
    if (van) await changeLevel(trx, { itemId, locationId: van.id, change: -u.quantity, allowNegative: true })
    await trx('stockMovements').insert({
      kind: 'fitted',
      itemId,
      fromLocationId: van?.id ?? null,
      quantity: u.quantity,
      visitId: f.visitId,
      stringId: f.stringId,
      clientId: f.clientId,
      userId: f.userId,
      at: f.at,
    })
    taken.push({ itemId, quantity: u.quantity })
  }
  return taken
}
