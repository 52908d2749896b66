// List, read, create, update (optimistic lock on `version`) and archive for any kind of the estate.
// Every write and its audit row (before and after) share one transaction.
import type { Db } from '../../db'
import { conflict, notFound } from '../../errors'
import type { Role } from '../../../shared/roles'
import { audit } from '../audit'
import { kindDefs, type KindDef } from './kinds'
import {
  checkGeometry,
  checkNotInUse,
  checkRefs,
  checkStringType,
  checkUnique,
  duplicateFromDb,
} from './checks'

export interface Actor {
  userId: number
  role: Role
  requestId?: string
}

export interface ListQuery {
  page: number
  pageSize: number
  q?: string
  archived: 'false' | 'true' | 'only'
}

const BOOLEANS = ['active', 'fuseFailed', 'dark', 'isolated', 'replaceNow', 'shunted']

function rowOut(def: KindDef, raw: Record<string, unknown>) {
  const out: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(raw)) {
    if (def.derived?.includes(k)) continue
    if (v instanceof Date) out[k] = v.toISOString()
    else if (BOOLEANS.includes(k)) out[k] = Boolean(v)
    else if (def.json?.includes(k) && typeof v === 'string') out[k] = JSON.parse(v)
    else out[k] = v
  }
  return out
}

async function withChildren(db: Db, def: KindDef, raw: Record<string, unknown>) {
  const row = rowOut(def, raw)
  return def.loadChildren ? { ...row, ...(await def.loadChildren(db, raw.id as number)) } : row
}

/** One row with its children; `read`: the row as this request has read it already (not read again). */
export async function getOne(db: Db, def: KindDef, id: number, read?: Record<string, unknown>) {
  const raw = read?.id === id ? read : await db(def.table).where({ id }).first()
  if (!raw) throw notFound(def.label)
  return withChildren(db, def, raw)
}

export async function listKind(db: Db, def: KindDef, q: ListQuery) {
  const base = db(def.table)
  if (q.archived === 'false') base.whereNull('archivedAt')
  if (q.archived === 'only') base.whereNotNull('archivedAt')
  if (q.q) {
    const like = `%${q.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`
    base.where((w) => {
      for (const c of def.search) w.orWhere(c, 'like', like)
    })
  }
  const [{ n }] = await base.clone().count({ n: '*' })
  const rows = await base
    .clone()
    .orderBy(def.search[0])
    .orderBy('id')
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .select('*')
  const items = []
  for (const r of rows) items.push(await withChildren(db, def, r))
  return { items, total: Number(n) }
}

/** The body's own columns (children live elsewhere); JSON columns as text. */
function columnsOf(def: KindDef, body: Record<string, unknown>) {
  const cols: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(body)) {
    if (k === 'version' || v === undefined || def.children?.includes(k)) continue
    cols[k] = def.json?.includes(k) && v !== null ? JSON.stringify(v) : v
  }
  return cols
}

async function write<T>(db: Db, def: KindDef, work: (trx: Db) => Promise<T>): Promise<T> {
  try {
    return await db.transaction(work)
  } catch (err) {
    throw duplicateFromDb(err, def)
  }
}

export function createKind(db: Db, def: KindDef, body: Record<string, unknown>, by: Actor) {
  return write(db, def, async (trx) => {
    await checkRefs(trx, def, body)
    await checkUnique(trx, def, body, body)
    if (def.kind === 'strings') checkGeometry(body)
    if (def.kind === 'string-types') checkStringType(body)
    const [id] = await trx(def.table).insert(columnsOf(def, body))
    await def.saveChildren?.(trx, id, body, by.role)
    const after = await getOne(trx, def, id)
    await audit(trx, { ...entry(def, by, 'create', id), details: { before: null, after } })
    return after
  })
}

export function updateKind(db: Db, def: KindDef, id: number, body: Record<string, unknown>, by: Actor) {
  return write(db, def, async (trx) => {
    const current = await trx(def.table).where({ id }).forUpdate().first()
    if (!current) throw notFound(def.label)
    const before = await withChildren(trx, def, current)
    const stale = () =>
      conflict('edit_conflict', 'Someone changed this meanwhile; reload to see their changes.', {
        current: before,
      })
    if (current.version !== body.version) throw stale()
    const changes = columnsOf(def, body)
    const merged = { ...before, ...body }
    await checkRefs(trx, def, changes)
    await checkUnique(trx, def, merged, changes, id)
    if (def.kind === 'strings') checkGeometry(merged)
    if (def.kind === 'string-types') checkStringType(merged)
    await def.beforeUpdate?.(trx, id, body)
    const n = await trx(def.table)
      .where({ id, version: body.version })
      .update({ ...changes, version: current.version + 1, updatedAt: new Date() })
    if (!n) throw stale()
    await def.saveChildren?.(trx, id, body, by.role)
    const extra = def.afterUpdate ? await def.afterUpdate(trx, id, changes) : {}
    const after = await getOne(trx, def, id)
    await audit(trx, { ...entry(def, by, 'update', id), details: { before, after } })
    return { ...after, ...extra }
  })
}

/** Archives (never deletes): the row keeps its history and leaves lists, the map and the queue. */
export function archiveKind(db: Db, def: KindDef, id: number, by: Actor) {
  return write(db, def, async (trx) => {
    const current = await trx(def.table).where({ id }).forUpdate().first()
    if (!current) throw notFound(def.label)
    const before = await withChildren(trx, def, current)
    if (current.archivedAt) return before
    await checkNotInUse(trx, def, id, kindDefs)
    const now = new Date()
    const extra = 'active' in current ? { active: false } : {}
    await trx(def.table)
      .where({ id })
      .update({ archivedAt: now, version: current.version + 1, updatedAt: now, ...extra })
    await def.afterArchive?.(trx, id)
    const after = await getOne(trx, def, id)
    await audit(trx, { ...entry(def, by, 'archive', id), details: { before, after } })
    return after
  })
}

const entry = (def: KindDef, by: Actor, action: string, id: number) => ({
  userId: by.userId,
  action,
  entity: def.entity,
  entityId: id,
  requestId: by.requestId,
})
