// Checks a write against other rows before it is made, so the answer names the field: a reference to
// a row that does not exist (400 unknown_reference) or a value another row already has (409 duplicate).
import type { Db } from '../../db'
import { badRequest, conflict, HttpError } from '../../errors'
import type { KindDef } from './kinds'
import { listOf, plural } from '../../../shared/number-format'

const field = (name: string, message: string) => ({ fields: [{ path: `body.${name}`, message }] })

/** References in `changes` (only those that change) must name rows that exist and are not archived. */
export async function checkRefs(db: Db, def: KindDef, changes: Record<string, unknown>) {
  for (const [name, table] of Object.entries(def.refs)) {
    const id = changes[name]
    if (id === undefined || id === null) continue
    const row = await db(table).where({ id }).first('id', 'archivedAt')
    if (!row || row.archivedAt)
      throw badRequest(
        'unknown_reference',
        `${name} ${String(id)} does not name an existing record.`,
        field(name, row ? 'That record is archived.' : 'No such record.'),
      )
  }
}

/**
 * A row that live rows of another kind still name (a site's strings, a string type's strings, a crew's
 * platform) stays until they are archived or moved: archiving it would leave them on the map and in the
 * queue under a record no list shows (409 in_use, with the counts).
 */
export async function checkNotInUse(db: Db, def: KindDef, id: number, all: KindDef[]) {
  const users: string[] = []
  for (const other of all)
    for (const [name, table] of Object.entries(other.refs)) {
      if (table !== def.table) continue
      const row = await db(other.table).where(name, id).whereNull('archivedAt').count({ n: '*' }).first()
      const n = Number(row?.n ?? 0)
      if (n) users.push(plural(n, `live ${other.label.toLowerCase()}`))
    }
  if (users.length)
    throw conflict(
      'in_use',
      `This ${def.label.toLowerCase()} is still used by ${listOf(users)}: archive or move them first.`,
      { inUse: users },
    )
}

/** Unique fields must not clash with another row (archived rows too: their history keeps the tag). */
export async function checkUnique(
  db: Db,
  def: KindDef,
  merged: Record<string, unknown>,
  changes: Record<string, unknown>,
  id?: number,
) {
  for (const u of def.unique) {
    if (changes[u.field] === undefined && (!u.scope || changes[u.scope] === undefined)) continue
    const q = db(def.table).where(u.field, merged[u.field] as string)
    if (u.scope) q.where(u.scope, merged[u.scope] as number)
    if (id) q.whereNot('id', id)
    if (await q.first('id'))
      throw conflict('duplicate', `Another ${def.label.toLowerCase()} already has this ${u.field}.`, {
        field: `body.${u.field}`,
        ...field(u.field, 'Already in use.'),
      })
  }
}

/** A unique index hit by a simultaneous write still answers 409, not 500. */
export function duplicateFromDb(err: unknown, def: KindDef): unknown {
  const e = err as { code?: string; sqlMessage?: string }
  if (e?.code !== 'ER_DUP_ENTRY') return err
  return new HttpError(409, 'duplicate', `Another ${def.label.toLowerCase()} already has this value.`, {
    message: e.sqlMessage,
  })
}

/** A drawn line needs its points; a point needs none. */
export function checkGeometry(merged: Record<string, unknown>) {
  if (merged.geometry === 'line' && !(Array.isArray(merged.line) && merged.line.length >= 2))
    throw badRequest(
      'validation_failed',
      'A line string needs at least two points.',
      field('line', 'Draw the line.'),
    )
}

/**
 * A string type's fields that go together: the driver's input range in order, hot amps with the volts
 * they were read at, and the LED driver data only on an LED type.
 */
export function checkStringType(merged: Record<string, unknown>) {
  const n = (k: string) => (typeof merged[k] === 'number' ? (merged[k] as number) : null)
  const min = n('driverMinVolts')
  const max = n('driverMaxVolts')
  if (min !== null && max !== null && min > max)
    throw badRequest(
      'validation_failed',
      'The driver input range runs from its lower to its upper volts.',
      field('driverMaxVolts', `Must be at least the lower limit, ${min} V.`),
    )
  if (n('referenceHotAmps') !== null && n('referenceVolts') === null)
    throw badRequest(
      'validation_failed',
      'A hot reading needs the volts it was taken at.',
      field('referenceVolts', 'Give the supply volts of the hot reading.'),
    )
}
