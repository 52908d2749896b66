import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import type { VisitBody } from '../../shared/schemas/visits'
import { conditionOf, shuntedLampCount, stateColumns, stringStatus } from '../../shared/string-status'
import { applyVisit, brightLampsError, countErrors, isRelamping, lampTotal } from '../../shared/visit-rules'
import { loadType, siteBurnHours } from './strings'
import { exposureColumns } from './string-engine'
import { requireIsolatedFor } from './isolations'
import { syncStringQueue } from './queue/strings'
import { writeOnce } from './keyed-write'

const invalid = (field: string, message: string) =>
  badRequest('validation_failed', message, { fields: [{ path: `body.${field}`, message }] })

async function existingVisit(db: Db, key: string) {
  const v = await db('visits as v')
    .join('strings as s', 's.id', 'v.stringId')
    .where('v.idempotencyKey', key)
    .first('v.id', 'v.brightLamps', 's.id as stringId', 's.lampsOut', 's.status', 's.replaceNow')
  return v
    ? {
        id: v.id as number,
        brightLamps: v.brightLamps as number,
        string: { id: v.stringId, lampsOut: v.lampsOut, status: v.status, replaceNow: !!v.replaceNow },
      }
    : undefined
}

interface Author {
  id: number
  crewId: number | null
}

/**
 * Logs a visit. The visit, the string's new counts and flags and its queue items commit together;
 * the same idempotency key again returns the first visit instead of a second one.
 */
export async function logVisit(db: Db, user: Author, key: string, body: VisitBody) {
  const { created, result } = await writeOnce(db, {
    index: 'visits_idempotency_key_unique',
    // A repeat waits for the first send on the string row, then finds its visit rather than counting
    // its lamps against the string the first send has already changed.
    lock: (trx) => trx('strings').where({ id: body.stringId }).forUpdate().first('id'),
    replay: (trx) => existingVisit(trx, key),
    create: (trx) => insertVisit(trx, user, key, body),
  })
  return { created, visit: result }
}

async function insertVisit(trx: Db, user: Author, key: string, body: VisitBody) {
  const s = await trx('strings').where({ id: body.stringId }).forUpdate().first()
  if (!s) throw notFound('String')
  const type = await loadType(trx, s.typeId)
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
  const burn = await siteBurnHours(trx, s.siteId)
  await trx('strings')
    .where({ id: s.id })
    .update({
      ...exposureColumns(type, s, burn, now, { fuseReplaced: !!body.fuseReplaced }),
      ...stateColumns(cond, assessed),
      lastVisitAt: now,
    })
  await syncStringQueue(trx, s.id, id, now)
  return {
    id: id as number,
    brightLamps: body.brightLamps ?? 0,
    string: { id: s.id, lampsOut: cond.lampsOut, status, replaceNow },
  }
}
