// One run of a job at a time across every server process on the database: a MariaDB named lock
// (GET_LOCK) held on one pooled connection while the job runs, released when it ends. A process
// that dies loses its connection, and MariaDB frees the lock with it.
import type { Knex } from 'knex'
import type { Db } from '../db'

export type LockedRun<T> = { ran: true; result: T } | { ran: false }

/** MariaDB names are at most 64 characters; the database's name keeps two apps on one server apart. */
const lockName = (name: string) => `:lw-job:${name}`.slice(0, 40)
const NAME_SQL = 'concat(left(database(), 20), ?)'

type Row = Record<string, unknown>
const firstValue = (raw: unknown): unknown => {
  const rows = (Array.isArray(raw) ? raw[0] : raw) as Row[] | undefined
  const row = rows?.[0]
  return row ? Object.values(row)[0] : null
}

/**
 * Runs `work` if no other process holds the lock `name`, else answers `{ ran: false }` at once (no
 * waiting: the other process is doing the same work).
 */
export async function withNamedLock<T>(db: Db, name: string, work: () => Promise<T>): Promise<LockedRun<T>> {
  const k = db as Knex
  const conn: unknown = await k.client.acquireConnection()
  const on = (sql: string, b: readonly Knex.RawBinding[]) => k.raw(sql, b).connection(conn)
  try {
    const got = firstValue(await on(`select get_lock(${NAME_SQL}, 0) as got`, [lockName(name)]))
    if (Number(got) !== 1) return { ran: false }
    try {
      return { ran: true, result: await work() }
    } finally {
      await on(`select release_lock(${NAME_SQL}) as released`, [lockName(name)])
    }
  } finally {
    await k.client.releaseConnection(conn)
  }
}
