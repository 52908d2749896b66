// A write keyed by the client's Idempotency-Key is stored once. Each keyed table has a UNIQUE index on
// the key; that index, not a read before the insert, decides which of two simultaneous sends is the
// first. The other send's insert waits for the first to commit, fails with a duplicate entry, and its
// transaction is run again as a fresh one (a transaction's plain reads see only what was committed
// before its first read): it then finds the first result and answers with it. Isolations, photos and
// public reports go through writeOnce; visits, batched (visits.ts), through retryOnDuplicate, the same
// rule around their own transaction.
import type { Db } from '../db'
import { conflict } from '../errors'

export interface KeyedWrite<T> {
  /** The UNIQUE index on the key (as MariaDB names it): a duplicate on any other index is a real error. */
  index: string
  /**
   * Runs first in the transaction and holds what a send changes (the string row of a visit), so a
   * repeat waits for the first send and then reads its result instead of checking against its effect.
   */
  lock?: (trx: Db) => Promise<unknown>
  /** The first send's result when this key is stored already (an isolation adds the steps it lacks). */
  replay: (trx: Db) => Promise<T | undefined>
  /** The first send: inserts the keyed row (and the rest) in the transaction. */
  create: (trx: Db) => Promise<T>
}

function isDuplicateOn(err: unknown, index: string): boolean {
  const e = err as { code?: string; sqlMessage?: string; message?: string }
  return e?.code === 'ER_DUP_ENTRY' && `${e.sqlMessage ?? e.message}`.includes(`'${index}'`)
}

/**
 * The keyed-write rule around any transaction that inserts under the key: a duplicate on `index` runs
 * `attempt` once more as a fresh transaction, which then finds the first send's result. Pass an
 * attempt that opens its own transaction on the pool.
 */
export async function retryOnDuplicate<T>(index: string, attempt: () => Promise<T>): Promise<T> {
  try {
    return await attempt()
  } catch (err) {
    if (!isDuplicateOn(err, index)) throw err
  }
  try {
    return await attempt()
  } catch (err) {
    // The first send is committed by now, so its result should have been found: answer, not crash.
    if (isDuplicateOn(err, index))
      throw conflict('idempotency_busy', 'A send with this Idempotency-Key is still being stored; try again.')
    throw err
  }
}

/**
 * Stores a keyed write once: `created` is false when the result is the first send's. Pass the
 * connection pool, not a transaction: the retry needs a fresh transaction to see the first send.
 */
export async function writeOnce<T>(db: Db, w: KeyedWrite<T>): Promise<{ created: boolean; result: T }> {
  return retryOnDuplicate(w.index, () =>
    db.transaction(async (trx) => {
      if (w.lock) await w.lock(trx)
      const earlier = await w.replay(trx)
      if (earlier !== undefined) return { created: false, result: earlier }
      return { created: true, result: await w.create(trx) }
    }),
  )
}
