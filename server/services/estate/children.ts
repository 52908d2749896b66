// What a kind keeps outside its own row: a string type's lamp classes, a crew's members; and the
// strings restated when their type changes.
import type { Db } from '../../db'
import { badRequest, forbidden } from '../../errors'
import { conditionOf, stringStatus } from '../../../shared/string-status'
import type { Role } from '../../../shared/roles'
import { loadType } from '../strings'
import { syncStringQueue } from '../queue/strings'
import { exposureColumns, stringRecordColumns } from '../string-engine'
import { burnHoursPerDay } from '../../../shared/schedule'

/** Who may move users between crews (issue 10 item 6): admins and supervisors. */
const membershipEditors: readonly Role[] = ['admin', 'supervisor']
/** Only field roles belong to a crew. */
const memberRoles = ['crew', 'supervisor']

export async function loadLampClasses(db: Db, typeId: number) {
  const rows = await db('lampClasses')
    .where({ stringTypeId: typeId })
    .orderBy('position')
    .select('label', 'count', 'ratedVolts', 'ratedAmps', 'shunted', 'ratedLifeHours', 'lifeExponent')
  return rows.map((c) => ({ ...c, shunted: Boolean(c.shunted) }))
}

export async function saveLampClasses(trx: Db, typeId: number, body: Record<string, unknown>) {
  const classes = body.lampClasses as Record<string, unknown>[] | undefined
  if (!classes) return
  await trx('lampClasses').where({ stringTypeId: typeId }).delete()
  await trx('lampClasses').insert(classes.map((c, i) => ({ ...c, stringTypeId: typeId, position: i + 1 })))
}

export async function loadMemberIds(db: Db, crewId: number): Promise<number[]> {
  const rows = await db('users').where({ crewId }).orderBy('id').select('id')
  return rows.map((r) => r.id as number)
}

/** Sets users.crew_id for the listed users and clears it for those left off. */
export async function saveMembers(trx: Db, crewId: number, body: Record<string, unknown>, role?: Role) {
  const ids = body.memberIds as number[] | undefined
  if (!ids) return
  const now = await loadMemberIds(trx, crewId)
  const same = now.length === ids.length && ids.every((id) => now.includes(id))
  if (same) return
  if (role && !membershipEditors.includes(role))
    throw forbidden('Only an administrator or a supervisor may change who is on a crew.')
  const users = ids.length ? await trx('users').whereIn('id', ids).select('id', 'role', 'active') : []
  for (const [i, id] of ids.entries()) {
    const u = users.find((x) => x.id === id)
    if (!u || !u.active)
      throw badRequest('unknown_reference', `User ${id} does not exist or is not active.`, {
        fields: [{ path: `body.memberIds.${i}`, message: 'No such active user.' }],
      })
    if (!memberRoles.includes(u.role as string))
      throw badRequest('not_field_role', 'Only crew members and supervisors can be on a crew.', {
        fields: [{ path: `body.memberIds.${i}`, message: `This user is a ${u.role}, not a crew member.` }],
      })
  }
  await trx('users').where({ crewId }).whereNotIn('id', ids).update({ crewId: null })
  if (ids.length) await trx('users').whereIn('id', ids).update({ crewId })
}

/** Restates strings against their type, as a changed threshold does; answers how many changed. */
export async function restateStrings(trx: Db, where: { typeId?: number; id?: number }) {
  const strings = await trx('strings')
    .where(where)
    .select(
      'id',
      'typeId',
      'lampsOut',
      'fuseFailed',
      'dark',
      'isolated',
      'lampAgeHours',
      'status',
      'replaceNow',
      'replaceRule',
    )
  let restated = 0
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  for (const s of strings) {
    if (!types.has(s.typeId)) types.set(s.typeId, await loadType(trx, s.typeId))
    const { status, replaceNow, result } = stringStatus(types.get(s.typeId)!, conditionOf(s))
    if (status === s.status && replaceNow === !!s.replaceNow) continue
    // A string flagged by the forecast's risk stays flagged until the forecast job judges it again.
    if (s.replaceRule === 'risk' && (status === 'lit' || status === 'watch')) continue
    const replaceRule = replaceNow ? 'ratio' : null
    await trx('strings')
      .where({ id: s.id })
      .update({ status, replaceNow, replaceRule, riskNote: null, maxRatio: result.maxRatio })
    await syncStringQueue(trx, s.id, null)
    restated++
  }
  return restated
}

/** Fields of a type whose change moves its lamps' ratios or life exponents. */
export const STRESS_FIELDS = [
  'technology',
  'wiring',
  'supplyVolts',
  'lifeExponent',
  'branches',
  'lampClasses',
]

/**
 * Before a change that moves the lamps' stress (a type's ratings, a string's type): the hours burned
 * since each string's last change are added to its exposure at the ratios in force until now.
 */
export async function accrueExposure(trx: Db, where: { typeId?: number; id?: number }, now = new Date()) {
  const strings = await trx('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .where(where.id ? { 's.id': where.id } : { 's.typeId': where.typeId })
    .select(...stringRecordColumns('s'), 'c.switchOn', 'c.switchOff')
  const types = new Map<number, Awaited<ReturnType<typeof loadType>>>()
  for (const s of strings) {
    if (!types.has(s.typeId)) types.set(s.typeId, await loadType(trx, s.typeId))
    const burn = burnHoursPerDay(s.switchOn, s.switchOff)
    await trx('strings')
      .where({ id: s.id })
      .update(exposureColumns(types.get(s.typeId)!, s, burn, now))
  }
}
