import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import type { VisitBody } from '../../shared/schemas/visits'
import { conditionOf, shuntedLampCount, stateColumns, stringStatus } from '../../shared/string-status'
import { applyVisit, brightLampsError, countErrors, isRelamping, lampTotal } from '../../shared/visit-rules'
import { typeOf, typeStampColumns, type TypeStamp } from './type-cache'
import { burnHoursPerDay } from '../../shared/schedule'
import { exposureColumns, type StringRecord } from './string-engine'
import { requireIsolatedFor } from './isolations'
import { syncStringQueue, type KnownString } from './queue/strings'
import { activeItemsColumn, activeItemsOf } from './queue/string-items'
import { writeOnce } from './keyed-write'
import { refreshSoon } from './queue/refresh-soon'
import { consumeFitted } from './stock-consume'

const invalid = (field: string, message: string) =>
  badRequest('validation_failed', message, { fields: [{ path: `body.${field}`, message }] })

/**
 * What a send needs besides the string, in one statement: the first send's visit under this key (if
 * any), the string's site and client, its active queue items and its type's stamp (type-cache.ts).
 * The transaction's first plain read, made after the string's lock, so its snapshot holds whatever a
 * first send committed.
 */
async function visitContext(db: Db, key: string, s: StringRow) {
  const r = await db('sites as si')
    .join('clients as c', 'c.id', 'si.clientId')
    .join('stringTypes as st', 'st.id', db.raw('?', [s.typeId]))
    .leftJoin('visits as v', 'v.idempotencyKey', db.raw('?', [key]))
    .where('si.id', s.siteId)
    .first(
      'si.clientId',
      'c.switchOn',
      'c.switchOff',
      'v.id as visitId',
      'v.brightLamps',
      ...typeStampColumns('st'),
      { items: activeItemsColumn(db, s.id, true) },
    )
  if (!r) throw notFound('Site')
  return {
    earlier:
      r.visitId == null ? undefined : { id: r.visitId as number, brightLamps: r.brightLamps as number },
    site: {
      clientId: r.clientId as number,
      switchOn: r.switchOn as string,
      switchOff: r.switchOff as string,
    },
    items: activeItemsOf(s.id, r.items),
    typeStamp: r as TypeStamp,
  }
}

type VisitContext = Awaited<ReturnType<typeof visitContext>>

/** A strings row as the lock reads it (every column). */
type StringRow = StringRecord &
  Omit<KnownString, 'clientId'> & { typeId: number; replaceNow: number | boolean }

interface Author {
  id: number
  crewId: number | null
}

/**
 * Logs a visit. The visit, the string's new counts and flags and its queue items commit together;
 * the same idempotency key again returns the first visit instead of a second one.
 */
export async function logVisit(db: Db, user: Author, key: string, body: VisitBody) {
  // The row the lock reads is the row the visit works from: read once per attempt, not again.
  let row: StringRow | undefined
  let ctx: VisitContext | undefined
  const { created, result } = await writeOnce(db, {
    index: 'visits_idempotency_key_unique',
    // A repeat waits for the first send on the string row, then finds its visit rather than counting
    // its lamps against the string the first send has already changed.
    lock: async (trx) => {
      row = await trx('strings').where({ id: body.stringId }).forUpdate().first()
      if (!row) throw notFound('String')
    },
    // The first send's visit with the string as it is now (the row the lock read).
    replay: async (trx) => {
      ctx = await visitContext(trx, key, row!)
      const s = row!
      return ctx.earlier
        ? {
            ...ctx.earlier,
            string: { id: s.id, lampsOut: s.lampsOut, status: s.status, replaceNow: !!s.replaceNow },
          }
        : undefined
    },
    create: (trx) => insertVisit(trx, user, key, body, row!, ctx!),
  })
  // The string's new forecast comes from a small refresh soon after; the visit does not wait for it.
  if (created) refreshSoon()
  return { created, visit: result }
}

async function insertVisit(
  trx: Db,
  user: Author,
  key: string,
  body: VisitBody,
  s: StringRow,
  { site, items, typeStamp }: VisitContext,
) {
  const type = await typeOf(trx, typeStamp)
  const counts = countErrors(s.lampsOut, body, shuntedLampCount(type))
  if (counts.failedFound) throw invalid('failedFound', counts.failedFound)
  if (counts.replaced) throw invalid('replaced', counts.replaced)
  const bright = brightLampsError(body.brightLamps ?? 0, lampTotal(type))
  if (bright) throw invalid('brightLamps', bright)
  let isolationId: number | null = body.isolationId ?? null
  if (body.isolationKey) {
    const iso = await trx('isolations').where({ idempotencyKey: body.isolationKey }).first('id')
    if (!iso)
      throw badRequest(
        'isolation_unknown',
        'The isolation for this visit has not arrived yet; send it first.',
      )
    isolationId = iso.id
  }
  if (isolationId) await requireIsolatedFor(trx, isolationId, s.id)
  else if (isRelamping(body) && !body.noIsolationReason) {
    throw badRequest(
      'isolation_required',
      'Record the isolation steps before relamping, or say why none was needed.',
    )
  }
  const cond = applyVisit(conditionOf(s), body)
  const assessed = stringStatus(type, cond)
  const { status, replaceNow } = assessed
  const now = new Date()
  const [id] = await trx('visits').insert({
    idempotencyKey: key,
    stringId: s.id,
    userId: user.id,
    crewId: user.crewId,
    isolationId,
    noIsolationReason: isolationId ? null : (body.noIsolationReason ?? null),
    visitedAt: body.visitedAt ? new Date(body.visitedAt) : now,
    failedFound: body.failedFound,
    replaced: body.replaced,
    fuseReplaced: !!body.fuseReplaced,
    darkOnArrival: !!body.darkOnArrival,
    brightLamps: body.brightLamps ?? 0,
    supplyVolts: body.readings?.supplyVolts ?? null,
    amps: body.readings?.amps ?? null,
    coldOhms: body.readings?.coldOhms ?? null,
    notes: body.notes ?? null,
    lampsOutBefore: s.lampsOut,
    lampsOutAfter: cond.lampsOut,
    statusAfter: status,
    lat: body.lat ?? null,
    lng: body.lng ?? null,
  })
  // The hours burned since the last change count at the ratios then in force, before this visit's change.
  const state = stateColumns(cond, assessed)
  await trx('strings')
    .where({ id: s.id })
    .update({
      ...exposureColumns(type, s, burnHoursPerDay(site.switchOn, site.switchOff), now, {
        fuseReplaced: !!body.fuseReplaced,
      }),
      ...state,
      lastVisitAt: now,
    })
  // The queue follows the string as just written: no need to read it back.
  await syncStringQueue(trx, s.id, id, now, { ...s, ...state, clientId: site.clientId }, items)
  // What was fitted comes off the crew's van in this same commit (a replay never gets here).
  await consumeFitted(trx, {
    visitId: id,
    userId: user.id,
    crewId: user.crewId,
    stringId: s.id,
    clientId: site.clientId,
    type,
    lamps: body.replaced,
    fuse: !!body.fuseReplaced,
    at: body.visitedAt ? new Date(body.visitedAt) : now,
  })
  return {
    id: id as number,
    brightLamps: body.brightLamps ?? 0,
    string: { id: s.id, lampsOut: cond.lampsOut, status, replaceNow },
  }
}
