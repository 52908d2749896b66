import type { z } from 'zod'
import type { Db } from '../db'
import { isoOrNull } from '../../shared/iso-time'
import type { RegisterFilters, RegisterSort, registerRow } from '../../shared/schemas/register'
import { matching, orderBy } from './register/page-order'

// As the database answers: times are Dates and the optional joins may be missing.
type Row = Omit<z.infer<typeof registerRow>, 'lastVisitAt' | 'forecastDarkAt'> & {
  lastVisitAt: Date | null
  forecastDarkAt: Date | null
}

/** The ids of one page of live strings matching the filters, in the page's order, and their total. */
export async function pageIds(
  db: Db,
  f: RegisterFilters & { sort: RegisterSort; dir: 'asc' | 'desc' },
  limit: number,
  offset: number,
): Promise<{ ids: number[]; total: () => Promise<number> }> {
  const [query, order] = await Promise.all([matching(db, f), orderBy(db, f.sort, f.dir)])
  const rows = await query().orderByRaw(order).select('s.id').limit(limit).offset(offset)
  const total = async () => Number((await query().count({ n: '*' }))[0].n)
  return { ids: rows.map((r: { id: number }) => r.id), total }
}

/** Strings by id with their type, place, circuit and structure, in the order of the ids. */
export async function withPlaces<T extends { id: number }>(
  db: Db,
  ids: number[],
  columns: string[],
): Promise<T[]> {
  if (!ids.length) return []
  const rows = (await db('strings as s')
    .join('stringTypes as t', 't.id', 's.typeId')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .leftJoin('circuits as ci', 'ci.id', 's.circuitId')
    .leftJoin('structures as st', 'st.id', 's.structureId')
    .whereIn('s.id', ids)
    .select('s.id', ...columns)) as T[]
  const byId = new Map(rows.map((r) => [r.id, r]))
  return ids.map((id) => byId.get(id)!).filter(Boolean)
}

export async function listRegister(
  db: Db,
  f: RegisterFilters & { page: number; pageSize: number; sort: RegisterSort; dir: 'asc' | 'desc' },
) {
  const { ids, total } = await pageIds(db, f, f.pageSize, (f.page - 1) * f.pageSize)
  // Independent reads, each on its own pooled connection.
  const [rows, n, sites, types] = await Promise.all([
    withPlaces<Row>(db, ids, [
      's.assetTag',
      's.name',
      's.status',
      's.lampsOut',
      't.code as typeCode',
      't.name as typeName',
      't.technology',
      'si.id as siteId',
      'si.name as siteName',
      'c.name as clientName',
      'ci.ref as circuitRef',
      'st.ref as structureRef',
      's.installedOn',
      's.lastVisitAt',
      's.forecastDarkAt',
      's.seasonState',
      's.storeBin',
      's.lat',
      's.lng',
    ]),
    total(),
    db('sites').whereNull('archivedAt').orderBy('name').select('id', 'name'),
    db('stringTypes').whereNull('archivedAt').orderBy('code').select('id', 'code', 'name'),
  ])
  return {
    items: rows.map((r) => ({
      ...r,
      circuitRef: r.circuitRef ?? null,
      structureRef: r.structureRef ?? null,
      installedOn: r.installedOn ?? null,
      lastVisitAt: isoOrNull(r.lastVisitAt),
      forecastDarkAt: isoOrNull(r.forecastDarkAt),
      storeBin: r.storeBin ?? null,
    })),
    total: n,
    sites,
    types,
  }
}
