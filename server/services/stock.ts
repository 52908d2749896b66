// Stock lists, transfers, count corrections and low-stock levels: each change, its movement and its
// audit row in one transaction.
import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import { audit } from './audit'
import type { AdjustmentBody, LowLevelBody, StockLine, TransferBody } from '../../shared/schemas/stock'
import { allPlaces, placeById, type Place } from './stock-places'
import { changeLevel, lockLevel } from './stock-levels'
import { checkAdjust, checkTransfer, readScope, type StockUser } from './stock-access'

/** Every active item at each place asked for (a place that never held an item shows 0). */
export async function listStock(db: Db, u: StockUser, q: { locationId?: number; crewId?: number }) {
  const place = q.locationId ? await placeById(db, q.locationId) : undefined
  const crewId = readScope(u, { crewId: q.crewId, place }) ?? q.crewId
  let places = await allPlaces(db)
  if (place) places = places.filter((p) => p.id === place.id)
  if (crewId !== undefined) places = places.filter((p) => p.crewId === crewId)
  if ((q.locationId || q.crewId) && !places.length) throw notFound('Stock location')
  return { items: await linesFor(db, places) }
}

async function linesFor(db: Db, places: Place[], itemId?: number): Promise<StockLine[]> {
  if (!places.length) return []
  const items: { id: number; name: string }[] = await db('stockItems')
    .where({ active: true })
    .modify((q) => (itemId ? q.where({ id: itemId }) : q))
    .orderByRaw("kind = 'spare', name")
    .select('id', 'name')
  const levels = await db('stockLevels')
    .whereIn(
      'locationId',
      places.map((p) => p.id),
    )
    .select('locationId', 'itemId', 'quantity', 'lowAt')
  const at = new Map(levels.map((l) => [`${l.locationId}:${l.itemId}`, l]))
  return places.flatMap((p) =>
    items.map((i) => {
      const l = at.get(`${p.id}:${i.id}`)
      return {
        locationId: p.id,
        locationKind: p.kind,
        crewId: p.crewId ?? null,
        locationName: p.name,
        itemId: i.id,
        itemName: i.name,
        quantity: l ? Number(l.quantity) : 0,
        lowAt: l?.lowAt == null ? null : Number(l.lowAt),
      }
    }),
  )
}

async function lineOf(db: Db, place: Place, itemId: number): Promise<StockLine> {
  return (await linesFor(db, [place], itemId))[0]
}

async function requireItem(db: Db, itemId: number) {
  const item = await db('stockItems').where({ id: itemId }).first('id', 'active')
  if (!item) throw notFound('Stock item')
  if (!item.active) throw badRequest('item_inactive', 'This item is no longer stocked.')
}

export function transferStock(db: Db, u: StockUser, b: TransferBody, requestId?: string) {
  return db.transaction(async (trx) => {
    await requireItem(trx, b.itemId)
    const [from, to] = [await placeById(trx, b.fromLocationId), await placeById(trx, b.toLocationId)]
    checkTransfer(u, from, to)
    // Both rows locked in one order, so two opposite transfers cannot deadlock.
    for (const id of [from.id, to.id].sort((x, y) => x - y)) await lockLevel(trx, b.itemId, id)
    await changeLevel(trx, { itemId: b.itemId, locationId: from.id, change: -b.quantity })
    await changeLevel(trx, { itemId: b.itemId, locationId: to.id, change: b.quantity })
    const [movementId] = await trx('stockMovements').insert({
      kind: 'transfer',
      itemId: b.itemId,
      fromLocationId: from.id,
      toLocationId: to.id,
      quantity: b.quantity,
      userId: u.id,
      at: new Date(),
    })
    await audit(trx, {
      userId: u.id,
      action: 'stock_transfer',
      entity: 'stock_item',
      entityId: b.itemId,
      details: { ...b, movementId },
      requestId,
    })
    return {
      movementId: Number(movementId),
      from: await lineOf(trx, from, b.itemId),
      to: await lineOf(trx, to, b.itemId),
    }
  })
}

export function adjustStock(db: Db, u: StockUser, b: AdjustmentBody, requestId?: string) {
  return db.transaction(async (trx) => {
    await requireItem(trx, b.itemId)
    const place = await placeById(trx, b.locationId)
    checkAdjust(u, place)
    const { quantity: before } = await lockLevel(trx, b.itemId, place.id)
    const change = b.quantity - before
    await changeLevel(trx, { itemId: b.itemId, locationId: place.id, change, allowNegative: true })
    const [movementId] = await trx('stockMovements').insert({
      kind: 'adjustment',
      itemId: b.itemId,
      toLocationId: place.id,
      quantity: change,
      reason: b.reason,
      userId: u.id,
      at: new Date(),
    })
    await audit(trx, {
      userId: u.id,
      action: 'stock_adjust',
      entity: 'stock_item',
      entityId: b.itemId,
      details: { locationId: place.id, before, after: b.quantity, reason: b.reason, movementId },
      requestId,
    })
    return { movementId: Number(movementId), change, line: await lineOf(trx, place, b.itemId) }
  })
}

export function setLowLevel(db: Db, userId: number, b: LowLevelBody, requestId?: string) {
  return db.transaction(async (trx) => {
    await requireItem(trx, b.itemId)
    const place = await placeById(trx, b.locationId)
    const { lowAt: before } = await lockLevel(trx, b.itemId, place.id)
    await trx('stockLevels').where({ itemId: b.itemId, locationId: place.id }).update({ lowAt: b.lowAt })
    await audit(trx, {
      userId,
      action: 'stock_low_level',
      entity: 'stock_item',
      entityId: b.itemId,
      details: { locationId: place.id, before, after: b.lowAt },
      requestId,
    })
    return lineOf(trx, place, b.itemId)
  })
}
