// One place changes a count: every transfer, correction and lamp fitted goes through `changeLevel`,
// inside its caller's transaction, so the low-stock notice follows every change exactly once.
import type { Db } from '../db'
import { conflict } from '../errors'
import { crossesLow } from '../../shared/stock-use'
import { noticeLowStock } from './notice-producers'

export interface LevelChange {
  itemId: number
  locationId: number
  /** Added to the count (negative takes away). */
  change: number
  /** Lamps fitted are recorded even when the van's count says there were none (the count was wrong). */
  allowNegative?: boolean
}

/** The level row, locked for the rest of the transaction (made at 0 when the place never held the item). */
export async function lockLevel(trx: Db, itemId: number, locationId: number) {
  await trx.raw('INSERT IGNORE INTO stock_levels (location_id, item_id, quantity) VALUES (?, ?, 0)', [
    locationId,
    itemId,
  ])
  const row = await trx('stockLevels').where({ itemId, locationId }).forUpdate().first('quantity', 'lowAt')
  return { quantity: Number(row.quantity), lowAt: row.lowAt == null ? null : Number(row.lowAt) }
}

export async function changeLevel(trx: Db, c: LevelChange) {
  const { quantity: before, lowAt } = await lockLevel(trx, c.itemId, c.locationId)
  const after = before + c.change
  if (after < 0 && c.change < 0 && !c.allowNegative)
    throw conflict(
      'stock_insufficient',
      `Only ${Math.max(0, before)} in stock here; cannot take ${-c.change}.`,
      {
        itemId: c.itemId,
        locationId: c.locationId,
        available: Math.max(0, before),
      },
    )
  await trx('stockLevels').where({ itemId: c.itemId, locationId: c.locationId }).update({ quantity: after })
  if (crossesLow(before, after, lowAt)) await noticeLowStock(trx, { ...c, quantity: after, lowAt })
  return { before, after, lowAt }
}
