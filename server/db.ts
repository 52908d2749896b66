// The Knex instance. Columns are snake_case in MariaDB and camelCase in code: identifiers are
// converted on the way in (wrapIdentifier) and row keys on the way out (postProcessResponse).
import knex, { type Knex } from 'knex'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('..', import.meta.url))

// Every identifier and every row key of every query goes through these: the names are the schema's
// (a few hundred), so each is converted once per process rather than by a regular expression each time.
const NAMES_KEPT = 10_000
function remembered(convert: (s: string) => string): (s: string) => string {
  const seen = new Map<string, string>()
  return (s) => {
    let out = seen.get(s)
    if (out === undefined) {
      out = convert(s)
      if (seen.size < NAMES_KEPT) seen.set(s, out)
    }
    return out
  }
}
const toSnake = remembered((s) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`))
const toCamel = remembered((s) => s.replace(/_([a-z0-9])/g, (_m, c: string) => c.toUpperCase()))

function isPlain(v: unknown): v is Record<string, unknown> {
  if (v === null || typeof v !== 'object') return false
  const proto = Object.getPrototypeOf(v)
  return proto === Object.prototype || proto === null
}

function camelRow(row: unknown): unknown {
  if (!isPlain(row)) return row
  const out: Record<string, unknown> = {}
  for (const k in row) out[toCamel(k)] = row[k]
  return out
}

export function camelize(result: unknown): unknown {
  if (Array.isArray(result)) return result.map((r) => (Array.isArray(r) ? r.map(camelRow) : camelRow(r)))
  return camelRow(result)
}

export function parseDatabaseUrl(url: string): Knex.MySql2ConnectionConfig {
  const u = new URL(url)
  return {
    host: u.hostname,
    port: Number(u.port || 3306),
    user: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: u.pathname.replace(/^\//, ''),
    charset: 'utf8mb4',
    timezone: 'Z',
    decimalNumbers: true,
    dateStrings: ['DATE'],
  } as unknown as Knex.MySql2ConnectionConfig
}

export function knexConfig(url: string): Knex.Config {
  return {
    client: 'mysql2',
    connection: url ? parseDatabaseUrl(url) : {},
    pool: { min: 0, max: 10 },
    migrations: { directory: `${root}migrations`, loadExtensions: ['.ts'], tableName: 'knex_migrations' },
    seeds: { directory: `${root}seeds`, loadExtensions: ['.ts'] },
    wrapIdentifier: (value, orig) => orig(value === '*' ? value : toSnake(value)),
    postProcessResponse: (result) => camelize(result),
  }
}

/**
 * What every service takes: the app's connection pool or a transaction, so a caller can commit the
 * work of several services at once. The one connection type of the server.
 */
export type Db = Knex | Knex.Transaction

/** A JSON column or JSON-built value as the driver hands it (text, or parsed already); `empty` for NULL. */
export function jsonColumn<T>(v: unknown, empty: T): T {
  return v == null ? empty : ((typeof v === 'string' ? JSON.parse(v) : v) as T)
}

export function createDb(url: string): Knex {
  return knex(knexConfig(url))
}
