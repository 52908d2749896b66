// The demo's lamp stock: the depot's shelves, each van's load (one van short of fuse lamps, one spare
// low, so the planner's warning and the low-stock marks show), and the season's fitted lamps from the
// seeded visits, so the usage report and order list have a season behind them. Invented figures.
import type { Db } from '../../server/db'
import { allPlaces, lampItemId } from '../../server/services/stock-places'
import { loadType } from '../../server/services/strings'
import { lampsByClass } from '../../shared/stock-use'

const DEPOT_LAMPS = 120
const DEPOT_SPARES = 60
const SPARES = ['Connector (pair)', 'Cable ties (bag of 100)']
const VAN_LAMPS = 24
const VAN_SPARES = 6

export async function seedStock(db: Db) {
  const places = await allPlaces(db)
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  for (const t of await db('stringTypes').select('id')) types.set(t.id, await loadType(db, t.id))
  const lampItems = new Set<number>()
  for (const type of types.values()) for (const c of type.classes) lampItems.add(await lampItemId(db, c))
  // The migration's spares went with the emptied tables: the demo stocks them again.
  if (!(await db('stockItems').where({ kind: 'spare' }).first('id')))
    await db('stockItems').insert(SPARES.map((name) => ({ kind: 'spare', name })))
  const spares = (await db('stockItems').where({ kind: 'spare' }).select('id')).map((r) => r.id as number)
  const levels = []
  for (const [n, p] of places.entries()) {
    const depot = p.kind === 'depot'
    for (const itemId of lampItems) {
      // The second van set out with no spare lamps of the first kind: the planner should warn.
      const short = n === 2 && itemId === [...lampItems][0]
      const quantity = depot ? DEPOT_LAMPS : short ? 0 : VAN_LAMPS
      levels.push({ locationId: p.id, itemId, quantity, lowAt: depot ? 40 : 5 })
    }
    for (const itemId of spares)
      levels.push({
        locationId: p.id,
        itemId,
        quantity: depot ? DEPOT_SPARES : VAN_SPARES,
        lowAt: depot ? 20 : 2,
      })
  }
  await db('stockLevels').insert(levels)
  await seedFitted(db, types)
}

/** The seeded visits' relamps as lamps fitted (the van counts above are today's, after them). */
async function seedFitted(db: Db, types: Map<number, Awaited<ReturnType<typeof loadType>>>) {
  const visits = await db('visits as v')
    .join('strings as s', 's.id', 'v.stringId')
    .join('sites as si', 'si.id', 's.siteId')
    .where((w) => w.where('v.replaced', '>', 0).orWhere('v.fuseReplaced', true))
    .select(
      'v.id',
      'v.userId',
      'v.crewId',
      'v.visitedAt',
      'v.replaced',
      'v.fuseReplaced',
      's.id as stringId',
      's.typeId',
      'si.clientId',
    )
  const vans = new Map(
    (await db('stockLocations').whereNotNull('crewId').select('id', 'crewId')).map((l) => [l.crewId, l.id]),
  )
  const rows = []
  for (const v of visits) {
    const type = types.get(v.typeId)!
    for (const u of lampsByClass(type, { lamps: v.replaced, fuse: !!v.fuseReplaced }))
      rows.push({
        kind: 'fitted',
        itemId: await lampItemId(db, type.classes[u.classIndex]),
        fromLocationId: vans.get(v.crewId) ?? null,
        quantity: u.quantity,
        visitId: v.id,
        stringId: v.stringId,
        clientId: v.clientId,
        userId: v.userId,
        at: v.visitedAt,
      })
  }
  for (let i = 0; i < rows.length; i += 200) await db('stockMovements').insert(rows.slice(i, i + 200))
}
