import type { Db } from '../db'
import { notFound } from '../errors'
import { conditionOf, stringStatus } from '../../shared/string-status'
import { loadType } from './strings'
import { syncStringQueue } from './queue/strings'

export async function listStringTypes(db: Db) {
  const rows = await db('stringTypes').whereNull('archivedAt').orderBy('code').select('id')
  const grouped = (await db('strings').groupBy('typeId').select('typeId', db.raw('count(*) as n'))) as {
    typeId: number
    n: number
  }[]
  const counts = new Map(grouped.map((r) => [r.typeId, Number(r.n)]))
  const out = []
  for (const r of rows) out.push({ ...(await loadType(db, r.id)), strings: counts.get(r.id) ?? 0 })
  return out
}

/** Changes a type's thresholds and life model, then restates every string of that type in one commit. */
export async function updateStringType(db: Db, id: number, patch: Record<string, number | undefined>) {
  return db.transaction(async (trx) => {
    const n = await trx('stringTypes').where({ id }).update(patch)
    if (!n) throw notFound('String type')
    const type = await loadType(trx, id)
    let restated = 0
    const strings = await trx('strings')
      .where({ typeId: id })
      .select('id', 'lampsOut', 'fuseFailed', 'dark', 'isolated', 'lampAgeHours', 'status', 'replaceNow')
    for (const s of strings) {
      const { status, replaceNow, result } = stringStatus(type, conditionOf(s))
      if (status === s.status && replaceNow === !!s.replaceNow) continue
      await trx('strings').where({ id: s.id }).update({ status, replaceNow, maxRatio: result.maxRatio })
      await syncStringQueue(trx, s.id, null)
      restated++
    }
    const count = Number((await trx('strings').where({ typeId: id }).count({ n: '*' }))[0].n)
    return { type: { ...type, strings: count }, restated }
  })
}
