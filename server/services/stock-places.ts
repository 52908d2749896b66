// The places that hold stock (the depot and one van per crew) and the items (one per lamp rating,
// plus spares), found or made when first needed: a crew created by any path has its van.
import type { Db } from '../db'
import { notFound } from '../errors'
import { lampItemName, lampKey } from '../../shared/stock-use'
import type { ClassSpec } from '../../shared/string-status'

export interface Place {
  id: number
  kind: 'depot' | 'van'
  name: string
  crewId: number | null
}

/** The depot's place (made on first use: the migration makes it, an emptied database may not). */
export async function depotPlace(db: Db): Promise<Place> {
  const row = await db('stockLocations').where({ kind: 'depot' }).orderBy('id').first()
  if (row) return row as Place
  await db('stockLocations').insert({ kind: 'depot', name: 'Depot' })
  return depotPlace(db)
}

/** A crew's van (made on first use, or by the crew's creation). */
export async function vanOf(db: Db, crewId: number): Promise<Place> {
  const row = await db('stockLocations').where({ crewId }).first()
  if (row) return row as Place
  const crew = await db('crews').where({ id: crewId }).first('name')
  if (!crew) throw notFound('Crew')
  // A simultaneous first use of the same van meets the UNIQUE crew_id: keep the one that won.
  await db.raw('INSERT IGNORE INTO stock_locations (kind, name, crew_id) VALUES (?, ?, ?)', [
    'van',
    `${crew.name} van`,
    crewId,
  ])
  return (await db('stockLocations').where({ crewId }).first()) as Place
}

/** Every place: the depot first, then each active crew's van by crew name. */
export async function allPlaces(db: Db): Promise<Place[]> {
  await depotPlace(db)
  const crews = await db('crews as c')
    .leftJoin('stockLocations as l', 'l.crewId', 'c.id')
    .where('c.active', true)
    .whereNull('l.id')
    .select('c.id')
  for (const c of crews) await vanOf(db, c.id)
  return db('stockLocations as l')
    .leftJoin('crews as c', 'c.id', 'l.crewId')
    .where((w) => w.whereNull('l.crewId').orWhere('c.active', true))
    .orderByRaw("l.kind = 'van', c.name, l.id")
    .select('l.id', 'l.kind', 'l.name', 'l.crewId') as Promise<Place[]>
}

export async function placeById(db: Db, id: number): Promise<Place> {
  const row = await db('stockLocations').where({ id }).first('id', 'kind', 'name', 'crewId')
  if (!row) throw notFound('Stock location')
  return row as Place
}

/** The stock item of a lamp class (made on first use: a type added after the migration). */
export async function lampItemId(db: Db, c: ClassSpec & { label: string }): Promise<number> {
  const key = lampKey(c)
  const row = await db('stockItems').where({ lampKey: key }).first('id')
  if (row) return row.id
  await db.raw('INSERT IGNORE INTO stock_items (kind, name, lamp_key) VALUES (?, ?, ?)', [
    'lamp',
    lampItemName(c),
    key,
  ])
  return (await db('stockItems').where({ lampKey: key }).first('id')).id
}
