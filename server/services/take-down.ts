// Taking a string down at the end of the season: its condition (lamps out, damage, cable,
// connectors), the store bin it goes to and photos (on the visit row it writes). Keyed by the
// device's Idempotency-Key like a visit. Marked for repair, it goes on the repair list until a
// pre-season inspection in store passes (commissioning.ts).
import type { Db } from '../db'
import { conflict } from '../errors'
import type { TakeDownBody, TakeDownResult } from '../../shared/schemas/season'
import { writeOnce } from './keyed-write'
import { insertSeasonVisit, lockString, type Author, type SeasonString } from './season'
import { syncSeasonItemsOf, UP_STATES } from './queue/season'
import { syncStringQueue } from './queue/strings'
import { iso } from '../../shared/iso-time'

export async function recordTakeDown(
  db: Db,
  user: Author,
  key: string,
  stringId: number,
  body: TakeDownBody,
): Promise<{ created: boolean; result: TakeDownResult }> {
  let s: SeasonString
  return writeOnce(db, {
    index: 'take_downs_idempotency_key_unique',
    lock: async (trx) => (s = await lockString(trx, stringId)),
    replay: async (trx) => {
      const t = await trx('takeDowns')
        .where({ idempotencyKey: key })
        .first('id', 'visitId', 'storeBin', 'forRepair')
      return t
        ? {
            id: t.id,
            visitId: t.visitId,
            storeBin: t.storeBin,
            seasonState: t.forRepair ? 'needs_repair' : 'taken_down',
          }
        : undefined
    },
    create: async (trx) => {
      if (!(UP_STATES as readonly string[]).includes(s.seasonState))
        throw conflict('not_installed', `${s.assetTag} is not up on the street, so it cannot be taken down.`)
      const at = body.doneAt ? new Date(body.doneAt) : new Date()
      const visitId = await insertSeasonVisit(trx, user, s, 'take_down', at, body)
      const [id] = await trx('takeDowns').insert({
        idempotencyKey: key,
        stringId: s.id,
        visitId,
        userId: user.id,
        crewId: user.crewId,
        doneAt: at,
        lampsOut: body.lampsOut,
        damage: body.damage ?? null,
        cable: body.cable,
        connectors: body.connectors,
        storeBin: body.storeBin,
        forRepair: body.forRepair,
        notes: body.notes ?? null,
      })
      const seasonState = body.forRepair ? 'needs_repair' : 'taken_down'
      await trx('strings').where({ id: s.id }).update({ seasonState, storeBin: body.storeBin })
      await syncSeasonItemsOf(trx, s.siteId, at)
      // Down off the street, its dark / replace-now / forecast items close in the same commit.
      await syncStringQueue(trx, s.id, null, at)
      return { id, visitId, seasonState, storeBin: body.storeBin }
    },
  })
}

/** Strings marked for repair, with what their take-down found. */
export async function listRepairs(db: Db) {
  const rows = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .join('clients as c', 'c.id', 'si.clientId')
    .leftJoin('takeDowns as t', function () {
      this.on('t.stringId', 's.id').andOn(
        't.id',
        db.raw('(select max(t2.id) from take_downs t2 where t2.string_id = s.id)'),
      )
    })
    .where('s.seasonState', 'needs_repair')
    .whereNull('s.archivedAt')
    .orderBy('s.assetTag')
    .select(
      's.id as stringId',
      's.assetTag',
      's.name as stringName',
      'c.name as clientName',
      's.storeBin',
      't.doneAt',
      't.lampsOut',
      't.damage',
      't.cable',
      't.connectors',
    )
  return {
    items: rows.map((r) => ({
      stringId: r.stringId,
      assetTag: r.assetTag,
      stringName: r.stringName,
      clientName: r.clientName,
      storeBin: r.storeBin ?? null,
      takenDownAt: r.doneAt ? iso(r.doneAt) : null,
      lampsOut: Number(r.lampsOut ?? 0),
      damage: r.damage ?? null,
      cable: r.cable ?? null,
      connectors: r.connectors ?? null,
    })),
  }
}
