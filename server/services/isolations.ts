import type { Knex } from 'knex'
import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import { isolateSteps, isolationSteps, restoreSteps, type IsolationBody } from '../../shared/schemas/visits'

type Trx = Knex | Knex.Transaction

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

export async function getIsolation(db: Trx, id: number) {
  const iso = await db('isolations').where({ id }).first('id', 'state', 'stringId', 'idempotencyKey')
  if (!iso) throw notFound('Isolation')
  const steps = await db('isolationSteps')
    .where({ isolationId: id })
    .orderBy('doneAt')
    .select('step', 'doneAt')
  return {
    id: iso.id,
    state: iso.state,
    stringId: iso.stringId,
    steps: steps.map((s) => ({ step: s.step, doneAt: new Date(s.doneAt).toISOString() })),
  }
}

/**
 * Records an isolation and its time-stamped steps. The same idempotency key again adds steps that
 * were not there yet (a crew may send the isolating steps first and the restoring ones later).
 */
export async function recordIsolation(
  db: Db,
  user: { id: number; crewId: number | null },
  key: string,
  body: IsolationBody,
) {
  return db.transaction(async (trx) => {
    const string = await trx('strings').where({ id: body.stringId }).first('id', 'circuitId')
    if (!string) throw notFound('String')
    let iso = await trx('isolations').where({ idempotencyKey: key }).forUpdate().first('id', 'stringId')
    let created = false
    if (iso && iso.stringId !== body.stringId)
      throw badRequest('idempotency_conflict', 'This key was used for another string.')
    if (!iso) {
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
      iso = { id, stringId: body.stringId }
      created = true
    }
    const existing = await trx('isolationSteps').where({ isolationId: iso.id }).select('step', 'doneAt')
    const have = new Set(existing.map((s) => s.step as string))
    const fresh = body.steps.filter((s) => !have.has(s.step))
    checkOrder([...existing, ...fresh])
    if (fresh.length) {
      await trx('isolationSteps').insert(
        fresh.map((s) => ({
          isolationId: iso.id,
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
    await trx('isolations').where({ id: iso.id }).update(patch)
    return { created, isolation: await getIsolation(trx, iso.id) }
  })
}

/** A relamp needs the string proven dead first: every isolating step recorded. */
export async function requireIsolatedFor(trx: Trx, isolationId: number, stringId: number) {
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
