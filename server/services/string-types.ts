import type { Db } from '../db'
import { notFound } from '../errors'
import { loadType } from './strings'
import { accrueExposure, restateStrings } from './estate/children'

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
    if (!(await trx('stringTypes').where({ id }).first('id'))) throw notFound('String type')
    // Hours burned so far count at the old life exponent: exposure is brought up to date first.
    if (patch.lifeExponent !== undefined) await accrueExposure(trx, { typeId: id })
    // A new version: the estate's form holding the old one is stale, and the type caches see the change.
    await trx('stringTypes')
      .where({ id })
      .update({ ...patch, version: trx.raw('version + 1'), updatedAt: new Date() })
    const type = await loadType(trx, id)
    const restated = await restateStrings(trx, { typeId: id })
    const count = Number((await trx('strings').where({ typeId: id }).count({ n: '*' }))[0].n)
    return { type: { ...type, strings: count }, restated }
  })
}
