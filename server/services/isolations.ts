import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import type { IsolationBody } from '../../shared/schemas/visits'
import { isolateSteps, isolationSteps, restoreSteps } from '../../shared/vocab/visits'
import { iso } from '../../shared/iso-time'
import { writeOnce } from './keyed-write'

function stateOf(done: Set<string>) {
  if (restoreSteps.every((s) => done.has(s))) return 'restored'
  if (isolateSteps.every((s) => done.has(s))) return 'isolated'
  return 'open'
}

/** Steps must follow the safe-isolation order in time: a later step may not be stamped before an earlier one. */
function checkOrder(steps: { step: string; doneAt: string | Date }[]) {
  const sorted = [...steps].sort(
    (a, b) => isolationSteps.indexOf(a.step as never) - isolationSteps.indexOf(b.step as never),
  )
  for (let i = 1; i < sorted.length; i++) {
    if (new Date(sorted[i].doneAt) < new Date(sorted[i - 1].doneAt)) {
      throw badRequest(
        'steps_out_of_order',
        `"${sorted[i].step}" is stamped before "${sorted[i - 1].step}".`,
        {
          step: sorted[i].step,
        },
      )
    }
  }
}

export async function getIsolation(db: Db, id: number) {
  const row = await db('isolations').where({ id }).first('id', 'state', 'stringId', 'idempotencyKey')
  if (!row) throw notFound('Isolation')
  const steps = await db('isolationSteps')
    .where({ isolationId: id })
    .orderBy('doneAt')
    .select('step', 'doneAt')
  return {
    id: row.id,
    state: row.state,
    stringId: row.stringId,
    steps: steps.map((s) => ({ step: s.step, doneAt: iso(s.doneAt) })),
  }
}

interface Author {
  id: number
  crewId: number | null
}

/**
 * Records an isolation and its time-stamped steps. The same idempotency key again adds steps that
 * were not there yet (a crew may send the isolating steps first and the restoring ones later).
 */
export async function recordIsolation(db: Db, user: Author, key: string, body: IsolationBody) {
  const { created, result } = await writeOnce(db, {
    index: 'isolations_idempotency_key_unique',
    replay: async (trx) => {
      const head = await trx('isolations').where({ idempotencyKey: key }).first('id', 'stringId')
      if (!head) return undefined
      if (head.stringId !== body.stringId)
        throw badRequest('idempotency_conflict', 'This key was used for another string.')
      return addSteps(trx, head.id, user, body)
    },
    create: async (trx) => {
      const string = await trx('strings').where({ id: body.stringId }).first('id', 'circuitId')
      if (!string) throw notFound('String')
      const startedAt = body.steps.length
        ? new Date(Math.min(...body.steps.map((s) => +new Date(s.doneAt))))
        : new Date()
      const [id] = await trx('isolations').insert({
        idempotencyKey: key,
        stringId: body.stringId,
        circuitId: body.circuitId ?? string.circuitId ?? null,
        userId: user.id,
        crewId: user.crewId,
        lockId: body.lockId ?? null,
        testerId: body.testerId ?? null,
        startedAt,
      })
      return addSteps(trx, id as number, user, body)
    },
  })
  return { created, isolation: result }
}

/** Adds the steps the isolation lacks and restates it; repeats of one key take their turn here. */
async function addSteps(trx: Db, id: number, user: Author, body: IsolationBody) {
  await trx('isolations').where({ id }).forUpdate().first('id')
  // Locking reads: they see the steps a repeat that went just before has committed.
  const stored = () =>
    trx('isolationSteps').where({ isolationId: id }).orderBy('doneAt').forShare().select('step', 'doneAt')
  const existing = await stored()
  const have = new Set(existing.map((s) => s.step as string))
  const fresh = body.steps.filter((s) => !have.has(s.step))
  checkOrder([...existing, ...fresh])
  if (fresh.length) {
    await trx('isolationSteps').insert(
      fresh.map((s) => ({
        isolationId: id,
        step: s.step,
        doneAt: new Date(s.doneAt),
        userId: user.id,
        value: s.value ?? null,
        note: s.note ?? null,
      })),
    )
  }
  const done = new Set([...have, ...fresh.map((s) => s.step)])
  const state = stateOf(done)
  const patch: Record<string, unknown> = { state }
  if (body.lockId) patch.lockId = body.lockId
  if (body.testerId) patch.testerId = body.testerId
  if (state === 'restored')
    patch.completedAt = new Date(Math.max(...[...existing, ...fresh].map((s) => +new Date(s.doneAt))))
  await trx('isolations').where({ id }).update(patch)
  const steps = fresh.length ? await stored() : existing
  return {
    id,
    state,
    stringId: body.stringId,
    steps: steps.map((s) => ({ step: s.step as string, doneAt: iso(s.doneAt) })),
  }
}

/** A relamp needs the string proven dead first: every isolating step recorded. */
export async function requireIsolatedFor(trx: Db, isolationId: number, stringId: number) {
  const iso = await getIsolation(trx, isolationId)
  if (iso.stringId !== stringId)
    throw badRequest('isolation_mismatch', 'That isolation was recorded for another string.')
  const done = new Set(iso.steps.map((s) => s.step))
  const missing = isolateSteps.filter((s) => !done.has(s))
  if (missing.length) {
    throw badRequest('isolation_incomplete', 'The isolation is missing steps that must come before work.', {
      missing,
    })
  }
  return iso
}
