// A string's season: the state it is in, the visit row each season record writes (so the field-photo
// upload carries its photos), marking it in service after a passed commissioning, and the season at a
// glance per client for the manager's home.
import { randomUUID } from 'node:crypto'
import type { Db } from '../db'
import { conflict, notFound } from '../errors'
import { passed } from '../../shared/commissioning-rules'
import { seasonStates, type SeasonState } from '../../shared/vocab/season'
import { clientZone } from './zones'
import { localDay } from '../../shared/local-time'
import { syncSeasonItemsOf } from './queue/season'

export interface Author {
  id: number
  crewId: number | null
}

/** A strings row as the season records read it under their lock. */
export interface SeasonString {
  id: number
  assetTag: string
  siteId: number
  circuitId: number | null
  structureId: number | null
  typeId: number
  lampsOut: number
  status: string
  seasonState: SeasonState
  storeBin: string | null
}

/** Reads and locks the string a season record works on; a repeat waits here for the first send. */
export async function lockString(trx: Db, id: number): Promise<SeasonString> {
  const s = await trx('strings').where({ id }).whereNull('archivedAt').forUpdate().first()
  if (!s) throw notFound('String')
  return s as SeasonString
}

/** The client's calendar day at `at` (a season record's date on the client's clock). */
export async function clientDay(db: Db, siteId: number, at: Date): Promise<string> {
  const site = await db('sites').where({ id: siteId }).first('clientId')
  return localDay(at, await clientZone(db, site?.clientId))
}

/** The visit row a season record writes: the string's history shows it and its photos attach to it. */
export async function insertSeasonVisit(
  trx: Db,
  user: Author,
  s: SeasonString,
  kind: 'commissioning' | 'store_inspection' | 'take_down',
  at: Date,
  o: { notes?: string | null; lat?: number | null; lng?: number | null } = {},
): Promise<number> {
  const [id] = await trx('visits').insert({
    // The record itself holds the device's key; the visit row only needs a unique one.
    idempotencyKey: randomUUID(),
    kind,
    stringId: s.id,
    userId: user.id,
    crewId: user.crewId,
    visitedAt: at,
    lampsOutBefore: s.lampsOut,
    lampsOutAfter: s.lampsOut,
    statusAfter: s.status,
    notes: o.notes ?? null,
    lat: o.lat ?? null,
    lng: o.lng ?? null,
  })
  return id as number
}

/** The newest commissioning since the string last came down, or undefined when there is none. */
export async function currentCommissioning(db: Db, stringId: number) {
  const down = await db('takeDowns').where({ stringId }).max({ at: 'doneAt' }).first()
  const q = db('commissionings').where({ stringId, kind: 'commissioning' })
  if (down?.at) q.where('doneAt', '>', down.at)
  return q
    .orderBy([
      { column: 'doneAt', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .first('id', 'result')
}

/** Marks a string in service (only after a passed commissioning) or back to installed (switched off). */
export async function setSeasonState(db: Db, stringId: number, state: 'in_service' | 'installed') {
  return db.transaction(async (trx) => {
    const s = await lockString(trx, stringId)
    if (!['installed', 'in_service'].includes(s.seasonState))
      throw conflict(
        'not_installed',
        `${s.assetTag} is ${s.seasonState.replace('_', ' ')}: commission it first.`,
      )
    if (state === 'in_service') {
      const c = await currentCommissioning(trx, stringId)
      if (!c)
        throw conflict(
          'not_commissioned',
          `${s.assetTag} has no commissioning record since it was installed.`,
        )
      if (!passed(c.result))
        throw conflict(
          'commissioning_failed',
          `${s.assetTag} failed its commissioning tests: put right what they found and test again.`,
        )
    }
    await trx('strings').where({ id: stringId }).update({ seasonState: state })
    await syncSeasonItemsOf(trx, s.siteId)
    return { id: stringId, seasonState: state }
  })
}

/** Each client's strings by season state (live strings only). */
export async function seasonGlance(db: Db) {
  const clients = await db('clients')
    .whereNull('archivedAt')
    .orderBy('name')
    .select('id', 'name', 'seasonStart', 'seasonEnd')
  const rows: { clientId: number; seasonState: SeasonState; n: number }[] = await db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .whereNull('s.archivedAt')
    .groupBy('si.clientId', 's.seasonState')
    .select('si.clientId', 's.seasonState', db.raw('count(*) as n'))
  return {
    clients: clients.map((c) => {
      const counts = Object.fromEntries(seasonStates.map((st) => [st, 0])) as Record<SeasonState, number>
      for (const r of rows) if (r.clientId === c.id) counts[r.seasonState] = Number(r.n)
      return {
        clientId: c.id as number,
        clientName: c.name as string,
        switchOnDate: (c.seasonStart as string | null) ?? null,
        switchOffDate: (c.seasonEnd as string | null) ?? null,
        counts,
        total: Object.values(counts).reduce((a, b) => a + b, 0),
      }
    }),
  }
}
