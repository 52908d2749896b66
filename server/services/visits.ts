// Logging a visit: the sends of one moment share a transaction (group-commit.ts), which locks their
// strings, reads what they need in one statement, checks and plans each send (visit-plan.ts) and
// stores them together; a key stored already answers with the first visit.
import { jsonColumn, type Db } from '../db'
import { HttpError, notFound } from '../errors'
import type { VisitBody } from '../../shared/schemas/visits'
import { typeStampColumns, type TypeStamp } from './type-cache'
import { activeItemsColumn, activeItemsOf } from './queue/string-items'
import { retryOnDuplicate } from './keyed-write'
import { groupCommit, type Settled } from './group-commit'
import { refreshSoon } from './queue/refresh-soon'
import {
  planVisit,
  storePlans,
  type Author,
  type Planned,
  type StringRow,
  type VisitOutcome,
  type VisitSend,
} from './visit-plan'

/**
 * Visits in one transaction at most (group-commit.ts), and such transactions at once per process. One
 * at a time makes the batches big enough to matter (measured with `npm run bench:api`: two at a time
 * averaged 1.5 visits a batch and gained nothing; one at a time 2–3 visits and about a third more
 * visits a second). Its cost: a batch that waits for a string's lock (an import holding it) holds up
 * the process's other visits until it has its lock.
 */
const MAX_BATCH = 16
const MAX_RUNNING = 1
const KEY_INDEX = 'visits_idempotency_key_unique'

/**
 * What the sends need besides their strings, in one statement: each string's site, client, type stamp
 * (type-cache.ts) and active queue items, and the visits already stored under any of the sends' keys.
 * The transaction's first plain read, made after the strings' locks, so its snapshot holds whatever a
 * first send committed.
 */
async function visitContexts(db: Db, ids: number[], keys: string[]) {
  const rows = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .join('stringTypes as st', 'st.id', 's.typeId')
    .whereIn('s.id', ids)
    .select(
      's.id',
      'si.clientId',
      'c.switchOn',
      'c.switchOff',
      ...typeStampColumns('st'),
      { items: activeItemsColumn(db, 's.id', true) },
      {
        earlier: db('visits as v')
          .whereIn('v.idempotencyKey', keys)
          .select(db.raw('json_arrayagg(json_array(v.idempotency_key, v.id, v.bright_lamps))')),
      },
    )
  const earlier = new Map<string, { id: number; brightLamps: number }>()
  for (const [key, id, brightLamps] of jsonColumn<[string, number, number][]>(rows[0]?.earlier, []))
    earlier.set(key, { id, brightLamps })
  const byString = new Map(
    rows.map((r) => [
      r.id as number,
      {
        site: {
          clientId: r.clientId as number,
          switchOn: r.switchOn as string,
          switchOff: r.switchOff as string,
        },
        items: activeItemsOf(r.id as number, r.items),
        typeStamp: r as TypeStamp,
      },
    ]),
  )
  return { earlier, byString }
}

/** A refused send (4xx) is that send's answer; anything else ends the whole transaction. */
async function settle<R>(f: () => Promise<R>): Promise<Settled<R>> {
  try {
    return { ok: true, value: await f() }
  } catch (error) {
    if (error instanceof HttpError && error.status < 500) return { ok: false, error }
    throw error
  }
}

/** A send checked: the first send's visit again (its key is stored), or the visit to store. */
type Checked = { replay: VisitOutcome } | { plan: Planned }

/**
 * Stores a batch of visits on distinct strings with distinct keys in one transaction: each string's
 * row is locked (read in id order, as every batch does, so two batches never deadlock each other),
 * then each send is checked and planned from the row the lock read, and the writes go together. A key
 * stored already answers with the first visit instead of a second one.
 */
async function writeVisits(trx: Db, sends: VisitSend[]): Promise<Settled<VisitOutcome>[]> {
  const locked = (await trx('strings')
    .whereIn(
      'id',
      sends.map((s) => s.body.stringId),
    )
    .orderBy('id')
    .forUpdate()) as StringRow[]
  const rows = new Map(locked.map((r) => [r.id, r]))
  const { earlier, byString } = await visitContexts(
    trx,
    [...rows.keys()],
    sends.map((s) => s.key),
  )
  const now = new Date()
  const checked: Settled<Checked>[] = []
  for (const send of sends)
    checked.push(
      await settle(async (): Promise<Checked> => {
        const row = rows.get(send.body.stringId)
        const ctx = byString.get(send.body.stringId)
        if (!row) throw notFound('String')
        if (!ctx) throw notFound('Site')
        const first = earlier.get(send.key)
        if (!first) return { plan: await planVisit(trx, send, row, ctx, now) }
        // The first send's visit with the string as it is now (the row the lock read).
        const string = {
          id: row.id,
          lampsOut: row.lampsOut,
          status: row.status,
          replaceNow: !!row.replaceNow,
        }
        return { replay: { created: false, visit: { ...first, string } } }
      }),
    )
  const plans = checked.flatMap((c) => (c.ok && 'plan' in c.value ? [c.value.plan] : []))
  const ids = plans.length ? await storePlans(trx, plans, now) : new Map<string, number>()
  return checked.map((c) => {
    if (!c.ok) return c
    if ('replay' in c.value) return { ok: true, value: c.value.replay }
    const { send, result } = c.value.plan
    return { ok: true, value: { created: true, visit: { ...result, id: ids.get(send.key)! } } }
  })
}

/** One send alone, under the keyed-write rule: a duplicate key is the first send, read again. */
const writeOne = (db: Db, send: VisitSend): Promise<Settled<VisitOutcome>> =>
  retryOnDuplicate(KEY_INDEX, () => db.transaction((trx) => writeVisits(trx, [send]))).then(
    ([settled]) => settled,
    (error: unknown) => ({ ok: false, error }),
  )

/** A batch in one transaction; if that fails (a key sent twice at once elsewhere, a deadlock), each alone. */
async function storeBatch(db: Db, sends: VisitSend[]): Promise<Settled<VisitOutcome>[]> {
  if (sends.length === 1) return [await writeOne(db, sends[0])]
  try {
    return await db.transaction((trx) => writeVisits(trx, sends))
  } catch {
    const out: Settled<VisitOutcome>[] = []
    for (const send of sends) out.push(await writeOne(db, send))
    return out
  }
}

const queues = new WeakMap<Db, (send: VisitSend) => Promise<VisitOutcome>>()

/**
 * Logs a visit. The visit, the string's new counts and flags and its queue items commit together;
 * the same idempotency key again returns the first visit instead of a second one. Visits sent at the
 * same moment share a transaction (group-commit.ts); two on one string never do.
 */
export async function logVisit(db: Db, user: Author, key: string, body: VisitBody) {
  let queue = queues.get(db)
  if (!queue) {
    queue = groupCommit((sends: VisitSend[]) => storeBatch(db, sends), {
      maxBatch: MAX_BATCH,
      maxRunning: MAX_RUNNING,
      clash: (a, b) => a.body.stringId === b.body.stringId || a.key === b.key,
    })
    queues.set(db, queue)
  }
  const outcome = await queue({ user, key, body })
  // The string's new forecast comes from a small refresh soon after; the visit does not wait for it.
  if (outcome.created) refreshSoon()
  return outcome
}
