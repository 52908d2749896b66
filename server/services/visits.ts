import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import type { VisitBody } from '../../shared/schemas/visits'
import { conditionOf, shuntedLampCount, stringStatus } from '../../shared/string-status'
import { applyVisit, countErrors, isRelamping } from '../../shared/visit-rules'
import { loadType } from './strings'
import { requireIsolatedFor } from './isolations'
import { syncStringQueue } from './queue/strings'

const invalid = (field: string, message: string) =>
  badRequest('validation_failed', message, { fields: [{ path: `body.${field}`, message }] })

async function existingVisit(db: Db, key: string) {
  const v = await db('visits as v')
    .join('strings as s', 's.id', 'v.stringId')
    .where('v.idempotencyKey', key)
    .first('v.id', 's.id as stringId', 's.lampsOut', 's.status', 's.replaceNow')
  return v
    ? {
        id: v.id,
        string: { id: v.stringId, lampsOut: v.lampsOut, status: v.status, replaceNow: !!v.replaceNow },
      }
    : null
}

/**
 * Logs a visit. The visit, the string's new counts and flags and its queue items commit together;
 * the same idempotency key again returns the first visit instead of a second one.
 */
export async function logVisit(
  db: Db,
  user: { id: number; crewId: number | null },
  key: string,
  body: VisitBody,
) {
  const replay = await existingVisit(db, key)
  if (replay) return { created: false, visit: replay }
  try {
    const visit = await db.transaction(async (trx) => {
      const s = await trx('strings').where({ id: body.stringId }).forUpdate().first()
      if (!s) throw notFound('String')
      const type = await loadType(trx as unknown as Db, s.typeId)
      const counts = countErrors(s.lampsOut, body, shuntedLampCount(type))
      if (counts.failedFound) throw invalid('failedFound', counts.failedFound)
      if (counts.replaced) throw invalid('replaced', counts.replaced)
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
      const { status, replaceNow, result } = stringStatus(type, cond)
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
      await trx('strings').where({ id: s.id }).update({
        lampsOut: cond.lampsOut,
        fuseFailed: cond.fuseFailed,
        dark: !result.lit,
        isolated: cond.isolated,
        status,
        replaceNow,
        maxRatio: result.maxRatio,
        lastVisitAt: now,
        // Relamping restarts the age clock only for the lamps replaced; we keep the string's age as the older lamps'.
      })
      await syncStringQueue(trx, s.id, id, now)
      return { id, string: { id: s.id, lampsOut: cond.lampsOut, status, replaceNow } }
    })
    return { created: true, visit }
  } catch (err) {
    // Two sends of one key at once: the loser of the unique index returns the winner's visit.
    if ((err as { code?: string }).code === 'ER_DUP_ENTRY') {
      const again = await existingVisit(db, key)
      if (again) return { created: false, visit: again }
    }
    throw err
  }
}
