// What the season used, by client and lamp class, and next season's order list. Days are the app's
// calendar days (APP_TIME_ZONE): a lamp fitted at 00:30 counts on the night's local day.
import type { Db } from '../db'
import { addDays, localInstant } from '../../shared/local-time'
import { lampsByClass, orderLines } from '../../shared/stock-use'
import type { UsageQuery } from '../../shared/schemas/stock'
import { loadType } from './strings'
import { lampItemId } from './stock-places'

function fittedBetween(db: Db, q: UsageQuery, zone: string) {
  const query = db('stockMovements as m').where('m.kind', 'fitted')
  if (q.from) query.where('m.at', '>=', localInstant(q.from, '00:00', zone))
  if (q.to) query.where('m.at', '<', localInstant(addDays(q.to, 1), '00:00', zone))
  if (q.clientId) query.where('m.clientId', q.clientId)
  return query
}

/** Lamps and spares fitted by visits, summed by client and item. */
export async function usageReport(db: Db, q: UsageQuery, zone: string) {
  type Row = {
    clientId: number | null
    clientName: string | null
    itemId: number
    itemName: string
    quantity: unknown
  }
  const rows: Row[] = await fittedBetween(db, q, zone)
    .join('stockItems as i', 'i.id', 'm.itemId')
    .leftJoin('clients as c', 'c.id', 'm.clientId')
    .groupBy('m.clientId', 'c.name', 'm.itemId', 'i.name')
    .orderBy([{ column: 'c.name' }, { column: 'quantity', order: 'desc' }, { column: 'i.name' }])
    .select('m.clientId', 'c.name as clientName', 'm.itemId', 'i.name as itemName')
    .sum({ quantity: 'm.quantity' })
  return {
    from: q.from ?? null,
    to: q.to ?? null,
    rows: rows.map((r) => ({
      clientId: r.clientId ?? null,
      clientName: r.clientName ?? 'No client',
      itemId: r.itemId,
      itemName: r.itemName,
      quantity: Number(r.quantity),
    })),
  }
}

/** The spare that replaces a damaged connector (stock migration's spares). */
const CONNECTOR_ITEM = 'Connector (pair)'

/**
 * What is known to be needed before the strings go up again, by item: for a string that is down (taken
 * down or on the repair list) the lamps its latest take-down counted out, and a connector pair when
 * that take-down found its connectors damaged; for any other string the lamps still out and a failed
 * fuse lamp recorded on it.
 */
export async function knownNeeds(db: Db): Promise<Map<number, number>> {
  type Row = { typeId: number; lampsOut: number; fuseFailed: number | boolean; connectors: string | null }
  const latest = db.raw('(select max(t2.id) from take_downs t2 where t2.string_id = s.id)')
  const rows: Row[] = await db('strings as s')
    .leftJoin('takeDowns as t', function () {
      this.on('t.stringId', 's.id').andOn('t.id', latest)
    })
    .whereNull('s.archivedAt')
    .select(
      's.typeId',
      's.fuseFailed',
      // Down with a take-down record: its count; otherwise the string's own.
      db.raw(
        "case when s.season_state in ('taken_down', 'needs_repair') and t.id is not null then t.lamps_out else s.lamps_out end as lamps_out",
      ),
      db.raw(
        "case when s.season_state in ('taken_down', 'needs_repair') then t.connectors else null end as connectors",
      ),
    )
  const needs = new Map<number, number>()
  const add = (itemId: number, n: number) => needs.set(itemId, (needs.get(itemId) ?? 0) + n)
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  let connectors = 0
  for (const r of rows) {
    if (r.connectors === 'damaged') connectors++
    if (!(Number(r.lampsOut) > 0) && !r.fuseFailed) continue
    if (!types.has(r.typeId)) types.set(r.typeId, await loadType(db, r.typeId))
    const type = types.get(r.typeId)!
    for (const u of lampsByClass(type, { lamps: Number(r.lampsOut), fuse: !!r.fuseFailed }))
      add(await lampItemId(db, type.classes[u.classIndex]), u.quantity)
  }
  if (connectors) {
    const item = await db('stockItems').where({ name: CONNECTOR_ITEM }).first('id')
    if (item) add(item.id, connectors)
  }
  return needs
}

/** Next season's order: the period's use plus the known needs, less what the depot and vans hold. */
export async function orderList(db: Db, q: UsageQuery, zone: string) {
  type Sum = { itemId: number; n: unknown }
  const used: Sum[] = await fittedBetween(db, q, zone)
    .groupBy('m.itemId')
    .select('m.itemId')
    .sum({ n: 'm.quantity' })
  const stock: Sum[] = await db('stockLevels')
    .where('quantity', '>', 0)
    .groupBy('itemId')
    .select('itemId')
    .sum({ n: 'quantity' })
  const items = await db('stockItems').where({ active: true }).select('id as itemId', 'name as itemName')
  const toMap = (rows: Sum[]) => new Map(rows.map((r) => [r.itemId, Number(r.n)]))
  return {
    from: q.from ?? null,
    to: q.to ?? null,
    lines: orderLines(items, toMap(used), await knownNeeds(db), toMap(stock)),
  }
}
