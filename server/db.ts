// The Knex instance. Columns are snake_case in MariaDB and camelCase in code: identifiers are
// converted on the way in (wrapIdentifier) and row keys on the way out (postProcessResponse).
import knex, { type Knex } from 'knex'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('..', import.meta.url))

const toSnake = (s: string): string => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)
const toCamel = (s: string): string => s.replace(/_([a-z0-9])/g, (_m, c: string) => c.toUpperCase())

function isPlain(v: unknown): v is Record<string, unknown> {
  if (v === null || typeof v !== 'object') return false
  const proto = Object.getPrototypeOf(v)
  return proto === Object.prototype || proto === null
}

function camelRow(row: unknown): unknown {
  if (!isPlain(row)) return row
  const out: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(row)) out[toCamel(k)] = v
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

export function createDb(url: string): Knex {
  return knex(knexConfig(url))
}
