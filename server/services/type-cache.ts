// A string type with its lamp classes, kept per process: every visit and string page needs it, and
// types change rarely. The key is the type's id, version and timestamps, which the caller reads in a
// statement it makes anyway (typeStampColumns); every change through the app raises the version (the
// estate's edit and archive, the admins' threshold change), so a changed type is a new key and an
// answer never comes from an older type than the one in the database at that read. Entries also
// expire after TYPE_CACHE_MS, which bounds what a change made outside the app (by hand in SQL, a
// demo reset that wipes and reloads every table) could leave behind.
import type { Db } from '../db'
import { loadType, type StringType } from './strings'

export const TYPE_CACHE_MS = 60_000
const MAX_TYPES = 500

const kept = new Map<string, { type: StringType; at: number }>()

export interface TypeStamp {
  typeId: number
  typeVersion: number
  typeCreatedAt: unknown
  typeUpdatedAt: unknown
}

/** The columns of a TypeStamp from the string type joined as `alias`. */
export const typeStampColumns = (alias: string) => [
  `${alias}.id as typeId`,
  `${alias}.version as typeVersion`,
  `${alias}.createdAt as typeCreatedAt`,
  `${alias}.updatedAt as typeUpdatedAt`,
]

const time = (v: unknown) => (v instanceof Date ? v.getTime() : String(v))

/** The type as stamped: from this process's cache when the stamp matches, else read (and kept). */
export async function typeOf(db: Db, s: TypeStamp, now = Date.now()): Promise<StringType> {
  const key = `${s.typeId}:${s.typeVersion}:${time(s.typeCreatedAt)}:${time(s.typeUpdatedAt)}`
  const hit = kept.get(key)
  if (hit && now - hit.at < TYPE_CACHE_MS) return hit.type
  const type = await loadType(db, s.typeId)
  // The stamp read before may be older than the type just read; keep it only when they agree.
  if ((type as { version?: number }).version === s.typeVersion) {
    if (kept.size >= MAX_TYPES) kept.clear()
    kept.set(key, { type, at: now })
  }
  return type
}

export function clearTypeCache(): void {
  kept.clear()
}
