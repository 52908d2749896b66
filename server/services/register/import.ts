// A register import: the file read and checked (on a pool thread when large), rows matched to the
// register by asset tag, then written in batches, each batch and its audit row in one transaction
// (upsert) or everything in one (strict).
import type { Db } from '../../db'
import { audit } from '../audit'
import type { ImportResult } from '../../../shared/schemas/register'
import { checkRows, type Checked, type Lookups, type StringFields } from './check-rows'
import { FileProblem, parseFile, type FileFormat } from './parse-file'
import { loadLookups } from './lookups'
import { badRequest, HttpError } from '../../errors'
import { accrueExposure, restateStrings } from '../estate/children'

export interface ImportOptions {
  bytes: Uint8Array
  format: FileFormat
  dryRun: boolean
  mode: 'upsert' | 'strict'
  userId: number
  requestId?: string
  /** Reads a large file off the event loop (the worker pool); absent in scripts. */
  readInPool?: (input: { bytes: Uint8Array; format: FileFormat; lookups: Lookups }) => Promise<Checked>
}

// Below this a file is read on the event loop: a few hundred rows take milliseconds.
const INLINE_BYTES = 64 * 1024
const BATCH = 1000

type Existing = {
  id: number
  assetTag: string
  archivedAt: Date | null
} & Record<string, unknown>

/** The row as the strings table holds it, for comparing and writing. */
function columns(f: StringFields) {
  return {
    name: f.name,
    typeId: f.typeId,
    siteId: f.siteId,
    circuitId: f.circuitId ?? null,
    structureId: f.structureId ?? null,
    geometry: f.geometry,
    // DECIMAL(9,6): compared and stored as the column keeps them.
    lat: Number(f.lat.toFixed(6)),
    lng: Number(f.lng.toFixed(6)),
    line: f.line ? JSON.stringify(f.line) : null,
    mountingHeightM: f.mountingHeightM == null ? null : Number(f.mountingHeightM.toFixed(2)),
    installedOn: f.installedOn ?? null,
  }
}

function same(row: ReturnType<typeof columns>, old: Existing): boolean {
  return Object.entries(row).every(([k, v]) => {
    const o = old[k]
    if (k === 'line') return (o == null ? null : JSON.stringify(o)) === v
    if (typeof v === 'number' && o != null) return Math.abs(Number(o) - v) < 1e-9
    return (o ?? null) === v
  })
}

async function read(db: Db, o: ImportOptions): Promise<Checked> {
  const lookups = await loadLookups(db)
  if (o.bytes.byteLength > INLINE_BYTES && o.readInPool)
    return o.readInPool({ bytes: o.bytes, format: o.format, lookups })
  try {
    return checkRows(await parseFile(o.bytes, o.format), lookups)
  } catch (err) {
    if (err instanceof FileProblem) throw new HttpError(err.status, err.code, err.message, err.details)
    throw err
  }
}

export async function importRegister(db: Db, o: ImportOptions): Promise<ImportResult & { written: boolean }> {
  if (o.bytes.byteLength === 0) throw badRequest('empty_file', 'The file is empty.')
  const checked = await read(db, o)
  const rejected = checked.rejected
  const creates: ReturnType<typeof columns>[] = []
  const updates: { id: number; row: ReturnType<typeof columns> }[] = []
  let unchanged = 0
  for (let i = 0; i < checked.valid.length; i += BATCH) {
    const part = checked.valid.slice(i, i + BATCH)
    const found = await db('strings')
      .whereIn(
        'assetTag',
        part.map((p) => p.fields.assetTag),
      )
      .select('*')
    const byTag = new Map(found.map((s: Existing) => [s.assetTag, s]))
    for (const { row, fields } of part) {
      const data = columns(fields)
      const old = byTag.get(fields.assetTag)
      if (!old) creates.push({ assetTag: fields.assetTag, ...data } as ReturnType<typeof columns>)
      else if (old.archivedAt) {
        const message = `String "${fields.assetTag}" is archived; restore it before importing it again.`
        rejected.push({ row, errors: [{ field: 'assetTag', code: 'archived', message }] })
      } else if (same(data, old)) unchanged++
      else updates.push({ id: old.id, row: data })
    }
  }
  rejected.sort((a, b) => a.row - b.row)
  const write = !o.dryRun && !(o.mode === 'strict' && rejected.length > 0)
  if (write) {
    try {
      await save(db, o, creates, updates)
    } catch (err) {
      // Another import or edit added one of these asset tags after the rows were matched.
      if ((err as { code?: string }).code === 'ER_DUP_ENTRY')
        throw new HttpError(
          409,
          'import_conflict',
          'Some asset tags were added meanwhile; run the import again.',
        )
      throw err
    }
  }
  return {
    dryRun: o.dryRun,
    mode: o.mode,
    written: write && creates.length + updates.length > 0,
    created: creates.length,
    updated: updates.length,
    unchanged,
    rejected,
  }
}

async function save(
  db: Db,
  o: ImportOptions,
  creates: ReturnType<typeof columns>[],
  updates: { id: number; row: ReturnType<typeof columns> }[],
): Promise<void> {
  const writeBatch = async (trx: Db, c: typeof creates, u: typeof updates) => {
    for (let i = 0; i < c.length; i += 500) await trx('strings').insert(c.slice(i, i + 500))
    // A string moved to another type: its exposure is brought up to now at the old type's ratios
    // first, and its state restated against the new type after (as an estate edit does).
    const before = new Map<number, number>()
    for (let i = 0; i < u.length; i += 500) {
      const ids = u.slice(i, i + 500).map((x) => x.id)
      for (const r of await trx('strings').whereIn('id', ids).select('id', 'typeId'))
        before.set(r.id, r.typeId)
    }
    for (const { id, row } of u) {
      const retyped = row.typeId !== before.get(id)
      if (retyped) await accrueExposure(trx, { id })
      await trx('strings')
        .where({ id })
        .update({ ...row, version: trx.raw('version + 1'), updatedAt: new Date() })
      if (retyped) await restateStrings(trx, { id })
    }
    await audit(trx, {
      userId: o.userId,
      action: 'register.import',
      entity: 'strings',
      details: { mode: o.mode, created: c.length, updated: u.length },
      requestId: o.requestId,
    })
  }
  if (o.mode === 'strict') {
    await db.transaction((trx) => writeBatch(trx, creates, updates))
    return
  }
  for (let i = 0; i < Math.max(creates.length, updates.length); i += BATCH)
    await db.transaction((trx) => writeBatch(trx, creates.slice(i, i + BATCH), updates.slice(i, i + BATCH)))
}
