// The key of a stored forecast's inputs: a string's type (every field of it and its lamp classes),
// its recorded condition, lamp age and exposure, and its client's switching times, zone and response
// time. Computed by MariaDB over the strings table in one statement, so the refresh reads back only
// the strings whose key no longer matches the one stored with their forecast.
import { createHash } from 'node:crypto'
import type { Db } from '../db'
import { loadType, type StringType } from '../services/strings'
import { CURVE_VERSION } from './forecast-curve'

/** Bump when the forecast job's own settings change (trials, what it stores). */
const JOB_VERSION = 'job-400-one-seed'

const sha1 = (text: string) => createHash('sha1').update(text).digest('hex')

// Bookkeeping that is not an input: an edit bumps `version`, so the key still changes.
const NOT_INPUTS = new Set(['createdAt', 'updatedAt', 'archivedAt'])

export interface KeyedType {
  type: StringType
  hash: string
}

/** Every string type with the hash of its fields and lamp classes. */
export async function typeHashes(db: Db): Promise<Map<number, KeyedType>> {
  const out = new Map<number, KeyedType>()
  for (const { id } of await db('stringTypes').select('id')) {
    const type = await loadType(db, id)
    const fields = Object.entries(type).filter(([k]) => !NOT_INPUTS.has(k))
    out.set(id, { type, hash: sha1(JSON.stringify(fields)) })
  }
  return out
}

/**
 * The SQL expression of a string's forecast key, over `strings as s` joined to `clients as c`.
 * NULLs are spelled out so that a missing value and an empty one differ.
 */
export function forecastKeySql(types: Map<number, KeyedType>): {
  sql: string
  bindings: (string | number)[]
} {
  const cases = [...types].map(() => 'when ? then ?').join(' ')
  const typeHash = types.size ? `case s.type_id ${cases} else 'none' end` : `'none'`
  const parts = [
    '?',
    typeHash,
    's.type_id',
    's.lamps_out',
    's.fuse_failed',
    's.dark',
    's.isolated',
    's.lamp_age_hours',
    `coalesce(s.lamp_exposure, '~')`,
    `coalesce(s.exposure_at, '~')`,
    'c.switch_on',
    'c.switch_off',
    `coalesce(c.time_zone, '~')`,
    // not a forecast input, but how far ahead the queue reads the curve (forecast-candidates.ts)
    'c.response_standard_hours',
  ]
  return {
    sql: `sha1(concat_ws('|', ${parts.join(', ')}))`,
    bindings: [`${JOB_VERSION}:${CURVE_VERSION}`, ...[...types].flatMap(([id, t]) => [id, t.hash])],
  }
}
