// How a register page finds its strings quickly at 20,000: the page's ids come from the strings table
// alone (read in index order for its own columns), and a column of another table (type code, site,
// client, circuit, structure) is turned into a rank of the foreign key, computed over that small table.
import type { Knex } from 'knex'
import type { Db } from '../../db'
import type { RegisterFilters, RegisterSort } from '../../../shared/schemas/register'

const own: Partial<Record<RegisterSort, string>> = {
  assetTag: 's.asset_tag',
  name: 's.name',
  // An ENUM sorts by its declared order: lit, watch, replace, dark, safe (urgency, not alphabet).
  status: 's.status',
  lampsOut: 's.lamps_out',
  installedOn: 's.installed_on',
  lastVisitAt: 's.last_visit_at',
  forecastDarkAt: 's.forecast_dark_at',
  // ENUM order again: in store, installed, in service, taken down, needs repair (the season's course).
  seasonState: 's.season_state',
}

// The foreign key of each other table's column, and its rows ranked by that column in SQL (so the
// rank follows the database's collation, ties included).
const ranked: Partial<Record<RegisterSort, { key: string; sql: string }>> = {
  type: { key: 's.type_id', sql: 'SELECT id, DENSE_RANK() OVER (ORDER BY code) AS rk FROM string_types' },
  site: { key: 's.site_id', sql: 'SELECT id, DENSE_RANK() OVER (ORDER BY name) AS rk FROM sites' },
  client: {
    key: 's.site_id',
    sql: 'SELECT si.id, DENSE_RANK() OVER (ORDER BY c.name) AS rk FROM sites si JOIN clients c ON c.id = si.client_id',
  },
  circuit: { key: 's.circuit_id', sql: 'SELECT id, DENSE_RANK() OVER (ORDER BY ref) AS rk FROM circuits' },
  structure: {
    key: 's.structure_id',
    sql: 'SELECT id, DENSE_RANK() OVER (ORDER BY ref) AS rk FROM structures',
  },
}

/** The SQL a page is ordered by: a column of strings, or a rank of a foreign key (NULL first, as a join would). */
async function orderExpr(db: Db, sort: RegisterSort): Promise<string> {
  const column = own[sort]
  if (column) return column
  const { key, sql } = ranked[sort]!
  const [rows] = (await db.raw(sql)) as [{ id: number; rk: number }[]]
  const groups = new Map<number, number[]>()
  for (const r of rows) groups.set(Number(r.rk), [...(groups.get(Number(r.rk)) ?? []), Number(r.id)])
  if (!rows.length) return key
  // Every value distinct: FIELD's position is the rank. Ids are numbers from the database.
  if (groups.size === rows.length)
    return `FIELD(${key}, ${[...groups.entries()]
      .sort((a, b) => a[0] - b[0])
      .map(([, ids]) => ids[0])
      .join(',')})`
  const whens = [...groups.entries()].map(([rk, ids]) => `WHEN ${key} IN (${ids.join(',')}) THEN ${rk}`)
  return `CASE ${whens.join(' ')} END`
}

/**
 * Live strings matching the filters, from the strings table alone: a search's site names are matched
 * in the small sites table first, so no join is needed.
 */
export async function matching(db: Db, f: RegisterFilters): Promise<() => Knex.QueryBuilder> {
  const like = f.q ? `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%` : null
  const siteIds = like
    ? (await db('sites').where('name', 'like', like).select('id')).map((r: { id: number }) => r.id)
    : []
  return () => {
    const q = db('strings as s').whereNull('s.archivedAt')
    if (f.siteId) q.where('s.siteId', f.siteId)
    if (f.typeId) q.where('s.typeId', f.typeId)
    if (f.status) q.where('s.status', f.status)
    if (f.season) q.where('s.seasonState', f.season)
    if (like)
      q.where((w) => {
        w.where('s.assetTag', 'like', like).orWhere('s.name', 'like', like)
        if (siteIds.length) w.orWhereIn('s.siteId', siteIds)
      })
    return q
  }
}

/**
 * The ORDER BY of a register page over `strings as s`, with the id as tie-break so pages never
 * overlap. (Returns SQL, not the query: a query builder is a thenable and would run if awaited.)
 */
export async function orderBy(db: Db, sort: RegisterSort, dir: 'asc' | 'desc'): Promise<string> {
  return `${await orderExpr(db, sort)} ${dir}, s.id ${dir}`
}
