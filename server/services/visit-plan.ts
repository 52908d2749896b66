// One visit checked against its string and turned into writes (planVisit), and a batch's writes
// made together (storePlans). visits.ts reads and locks the strings and runs the transaction.
import type { Db } from '../db'
import { badRequest } from '../errors'
import type { VisitBody } from '../../shared/schemas/visits'
import { conditionOf, shuntedLampCount, stateColumns, stringStatus } from '../../shared/string-status'
import { applyVisit, brightLampsError, countErrors, isRelamping, lampTotal } from '../../shared/visit-rules'
import { typeOf, type TypeStamp } from './type-cache'
import { burnHoursPerDay } from '../../shared/schedule'
import { exposureColumns, type StringRecord } from './string-engine'
import { requireIsolatedFor } from './isolations'
import { syncStringQueue, type KnownString } from './queue/strings'
import type { ActiveItem } from './queue/string-items'
import { consumeFitted } from './stock-consume'
import { updateById } from './update-by-id'

const invalid = (field: string, message: string) =>
  badRequest('validation_failed', message, { fields: [{ path: `body.${field}`, message }] })

/** What a send needs besides its string row (visits.ts reads it for a whole batch in one statement). */
export interface VisitContext {
  site: { clientId: number; switchOn: string; switchOff: string }
  items: ActiveItem[]
  typeStamp: TypeStamp
}

/** A strings row as the lock reads it (every column). */
export type StringRow = StringRecord &
  Omit<KnownString, 'clientId'> & { typeId: number; replaceNow: number | boolean }

export interface Author {
  id: number
  crewId: number | null
}

export interface VisitSend {
  user: Author
  key: string
  body: VisitBody
}

export interface VisitOutcome {
  created: boolean
  visit: {
    id: number
    brightLamps: number
    string: { id: number; lampsOut: number; status: string; replaceNow: boolean }
  }
}

/** A checked send: its visit row, the string's new columns and what follows from them. */
export interface Planned {
  send: VisitSend
  visit: Record<string, unknown>
  stringUpdate: Record<string, unknown>
  known: KnownString
  items: ActiveItem[]
  fitting: Omit<Parameters<typeof consumeFitted>[1], 'visitId'>
  /** The answer, but for the visit's id (known once inserted). */
  result: Omit<VisitOutcome['visit'], 'id'>
}

/** Checks one send against its string (refusing with a 4xx) and works out what it writes; reads only. */
export async function planVisit(
  trx: Db,
  { user, key, body }: VisitSend,
  s: StringRow,
  { site, items, typeStamp }: VisitContext,
  now: Date,
): Promise<Planned> {
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
  const visitedAt = body.visitedAt ? new Date(body.visitedAt) : now
  // The hours burned since the last change count at the ratios then in force, before this visit's change.
  const state = stateColumns(cond, assessed)
  return {
    send: { user, key, body },
    visit: {
      idempotencyKey: key,
      stringId: s.id,
      userId: user.id,
      crewId: user.crewId,
      isolationId,
      noIsolationReason: isolationId ? null : (body.noIsolationReason ?? null),
      visitedAt,
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
    },
    stringUpdate: {
      ...exposureColumns(type, s, burnHoursPerDay(site.switchOn, site.switchOff), now, {
        fuseReplaced: !!body.fuseReplaced,
      }),
      ...state,
      lastVisitAt: now,
    },
    // The queue follows the string as just written: no need to read it back.
    known: { ...s, ...state, clientId: site.clientId },
    items,
    fitting: {
      userId: user.id,
      crewId: user.crewId,
      stringId: s.id,
      clientId: site.clientId,
      type,
      lamps: body.replaced,
      fuse: !!body.fuseReplaced,
      at: visitedAt,
    },
    result: {
      brightLamps: body.brightLamps ?? 0,
      string: { id: s.id, lampsOut: cond.lampsOut, status, replaceNow },
    },
  }
}

/**
 * The batch's writes: its visits in one insert, its strings in one update, then each string's queue
 * items and its van's stock. Answers each new visit's id by its key.
 */
export async function storePlans(trx: Db, plans: Planned[], now: Date): Promise<Map<string, number>> {
  const insert = trx('visits')
    .insert(plans.map((p) => p.visit))
    .toSQL()
    .toNative()
  // MariaDB answers the new ids in the same statement (INSERT … RETURNING, 10.5+).
  const [inserted] = (await trx.raw(
    `${insert.sql} returning id, idempotency_key`,
    insert.bindings,
  )) as unknown as [{ id: number; idempotencyKey: string }[]]
  const ids = new Map(inserted.map((r) => [r.idempotencyKey, r.id]))
  // Every string of the batch in one statement (their columns are the same: exposure, state, visit time).
  await updateById(
    trx,
    'strings',
    plans.map((p) => ({ id: p.known.id, ...p.stringUpdate })),
    Object.keys(plans[0].stringUpdate),
  )
  for (const p of plans) {
    const visitId = ids.get(p.send.key)
    if (visitId === undefined) throw new Error(`visit ${p.send.key} was not stored`)
    await syncStringQueue(trx, p.known.id, visitId, now, p.known, p.items)
    // What was fitted comes off the crew's van in this same commit (a replay never gets here).
    await consumeFitted(trx, { ...p.fitting, visitId })
  }
  return ids
}
