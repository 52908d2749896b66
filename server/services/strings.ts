import { jsonColumn, type Db } from '../db'
import { notFound } from '../errors'
import type { MapItem, StringDetail } from '../../shared/schemas/strings'
import type { TypeSpec } from '../../shared/string-status'
import type { StringStatus } from '../../shared/vocab/string-states'
import { burnHoursPerDay } from '../../shared/schedule'

/** A string's drawn line from its JSON column ([lng, lat] points), null for a point string. */
export const lineOf = (v: unknown) => jsonColumn<[number, number][] | null>(v, null)

export async function listForMap(
  db: Db,
  q: { bbox?: [number, number, number, number]; q?: string; status?: StringStatus; limit: number },
): Promise<{ items: MapItem[]; truncated: boolean }> {
  const query = db('strings as s').select(
    's.id',
    's.assetTag',
    's.name',
    's.lat',
    's.lng',
    's.status',
    's.lampsOut',
    's.replaceNow',
    's.line',
  )
  if (q.bbox) {
    const [minLng, minLat, maxLng, maxLat] = q.bbox
    query.whereBetween('s.lat', [minLat, maxLat]).whereBetween('s.lng', [minLng, maxLng])
  }
  query.whereNull('s.archivedAt') // archived strings leave the map; their history stays
  if (q.status) query.where('s.status', q.status)
  if (q.q) {
    const like = `%${q.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`
    query
      .join('sites as site', 'site.id', 's.siteId')
      .where((w) =>
        w
          .where('s.assetTag', 'like', like)
          .orWhere('site.name', 'like', like)
          .orWhere('s.name', 'like', like),
      )
  }
  const rows = await query.orderBy('s.id').limit(q.limit + 1)
  const truncated = rows.length > q.limit
  return {
    truncated,
    items: rows
      .slice(0, q.limit)
      .map((r) => ({ ...r, replaceNow: Boolean(r.replaceNow), line: lineOf(r.line) })),
  }
}

export async function findByTag(db: Db, tag: string) {
  const r = await db('strings').where({ assetTag: tag.toUpperCase() }).first('id', 'assetTag')
  if (!r) throw notFound(`String ${tag}`)
  return r as { id: number; assetTag: string }
}

const CLASS_COLUMNS = [
  'label',
  'count',
  'ratedVolts',
  'ratedAmps',
  'shunted',
  'ratedLifeHours',
  'lifeExponent',
] as const
const classKey = (c: string) => `class${c[0].toUpperCase()}${c.slice(1)}`

/** A string type with its lamp classes in order: one statement (the type's columns on each class row). */
export async function loadType(db: Db, typeId: number) {
  const rows: Record<string, unknown>[] = await db('stringTypes as st')
    .leftJoin('lampClasses as lc', 'lc.stringTypeId', 'st.id')
    .where('st.id', typeId)
    .orderBy('lc.position')
    .select('st.*', 'lc.id as classId', ...CLASS_COLUMNS.map((c) => `lc.${c} as ${classKey(c)}`))
  if (!rows.length) throw notFound('String type')
  const t: Record<string, unknown> = { ...rows[0] }
  for (const c of ['classId', ...CLASS_COLUMNS]) delete t[c === 'classId' ? c : classKey(c)]
  const classes = rows
    .filter((r) => r.classId != null)
    .map((r) => {
      const k = Object.fromEntries(CLASS_COLUMNS.map((c) => [c, r[classKey(c)]]))
      return { ...k, shunted: Boolean(k.shunted) }
    })
  return { ...t, classes } as unknown as TypeSpec & StringDetail['type'] & { id: number }
}

export type StringType = Awaited<ReturnType<typeof loadType>>

/** The hours a night a site's client burns its lights (switch-on to switch-off). */
export async function siteBurnHours(db: Db, siteId: number): Promise<number> {
  const c = await db('sites as si')
    .join('clients as c', 'c.id', 'si.clientId')
    .where('si.id', siteId)
    .first('c.switchOn', 'c.switchOff')
  if (!c) throw notFound('Site')
  return burnHoursPerDay(c.switchOn, c.switchOff)
}
