// Commissioning a string (installed and tested before switch-on) and the pre-season inspection in
// store, which takes the same readings. Both are keyed by the device's Idempotency-Key like a visit:
// a replay answers the first record. A commissioning refuses (409) a column or anchor without a
// current structural approval; its readings are judged by the certificates' rule
// (shared/commissioning-rules.ts).
import type { Db } from '../db'
import { conflict, notFound } from '../errors'
import type {
  CommissioningBody,
  CommissioningResult,
  StoreInspectionBody,
  TestReadings,
} from '../../shared/schemas/season'
import {
  clearanceFindings,
  judgeSeasonTest,
  lampsOutFindings,
  passed,
  readingFindings,
} from '../../shared/commissioning-rules'
import { writeOnce } from './keyed-write'
import { lapse, newestCertificates, STRUCTURAL_APPROVAL } from './certificate-approvals'
import { clientDay, insertSeasonVisit, lockString, type Author, type SeasonString } from './season'
import { syncSeasonItemsOf } from './queue/season'
import { consumeFitted } from './stock-consume'
import { loadType } from './strings'

/** The client a site belongs to (for the season's stock use by client). */
const siteClient = async (db: Db, siteId: number) =>
  ((await db('sites').where({ id: siteId }).first('clientId'))?.clientId as number | undefined) ?? null

const parse = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v)

async function replay(db: Db, key: string): Promise<CommissioningResult | undefined> {
  const c = await db('commissionings as c')
    .join('strings as s', 's.id', 'c.stringId')
    .where('c.idempotencyKey', key)
    .first('c.id', 'c.visitId', 'c.kind', 'c.result', 'c.findings', 's.seasonState')
  if (!c) return undefined
  return {
    id: c.id,
    visitId: c.visitId,
    kind: c.kind,
    result: c.result,
    findings: parse(c.findings) ?? [],
    seasonState: c.seasonState,
  }
}

/** The string's circuit facts fill what the readings leave out, as a circuit's certificate does. */
async function withCircuit(db: Db, s: SeasonString, r: TestReadings): Promise<TestReadings> {
  const c = s.circuitId
    ? await db('circuits').where({ id: s.circuitId }).first('supplyVolts', 'rcdMa', 'rcdType')
    : undefined
  if (!c) return r
  return {
    ...r,
    rcdType: r.rcdType ?? (c.rcdType === 'S' ? 'S' : 'general'),
    ratedMa: r.ratedMa ?? (c.rcdMa === null ? undefined : Number(c.rcdMa)),
    circuitVolts: r.circuitVolts ?? Number(c.supplyVolts),
  }
}

/** The fixing's structural approval on `day`; throws 409 with the reason when it is missing or lapsed. */
async function checkFixing(db: Db, structureId: number, day: string): Promise<string | null> {
  const st = await db('structures').where({ id: structureId }).first('id', 'kind', 'ref')
  if (!st) throw notFound('Structure')
  if (!['column', 'anchor'].includes(st.kind)) return null
  const what = STRUCTURAL_APPROVAL.what(st.kind)
  const cert = (await newestCertificates(db, [...STRUCTURAL_APPROVAL.kinds], 'structure', [st.id])).get(st.id)
  const why = lapse(cert, day, what)
  if (why)
    throw conflict(
      'structure_not_approved',
      `${st.kind === 'column' ? 'Column' : 'Anchor'} ${st.ref} has no current structural approval: ${why}. Nothing may be hung on it until it passes.`,
      { structureId: st.id, reason: why },
    )
  return `${what}${cert?.reference ? ` ${cert.reference}` : ''}, due ${cert?.nextDue ?? 'no date'}`
}

export async function recordCommissioning(
  db: Db,
  user: Author,
  key: string,
  stringId: number,
  body: CommissioningBody,
): Promise<{ created: boolean; result: CommissioningResult }> {
  let s: SeasonString
  return writeOnce(db, {
    index: 'commissionings_idempotency_key_unique',
    lock: async (trx) => (s = await lockString(trx, stringId)),
    replay: (trx) => replay(trx, key),
    create: async (trx) => {
      if (s.seasonState === 'needs_repair')
        throw conflict('needs_repair', `${s.assetTag} is on the repair list: inspect it in store first.`)
      const at = body.doneAt ? new Date(body.doneAt) : new Date()
      const day = await clientDay(trx, s.siteId, at)
      const structureId = body.structureId ?? s.structureId
      const approvalNote = structureId ? await checkFixing(trx, structureId, day) : null
      const type = await trx('stringTypes').where({ id: s.typeId }).first('supplyVolts')
      const readings = await withCircuit(trx, s, body.readings)
      const judged = judgeSeasonTest([
        ...clearanceFindings(body.place, body.mountingHeightM, type ? Number(type.supplyVolts) : undefined),
        ...readingFindings(readings),
        ...lampsOutFindings(body.lampsOut),
      ])
      const visitId = await insertSeasonVisit(trx, user, s, 'commissioning', at, body)
      const [id] = await trx('commissionings').insert({
        idempotencyKey: key,
        kind: 'commissioning',
        stringId: s.id,
        visitId,
        userId: user.id,
        crewId: user.crewId,
        doneAt: at,
        structureId: structureId ?? null,
        approvalNote,
        place: body.place,
        mountingHeightM: body.mountingHeightM,
        readings: JSON.stringify(readings),
        lampsOut: body.lampsOut,
        result: judged.result,
        findings: JSON.stringify(judged.findings),
        notes: body.notes ?? null,
        lat: body.lat ?? null,
        lng: body.lng ?? null,
      })
      // Lamps fitted while putting it up come off the crew's van in this same commit, as on a visit.
      await consumeFitted(trx, {
        visitId,
        userId: user.id,
        crewId: user.crewId,
        stringId: s.id,
        clientId: await siteClient(trx, s.siteId),
        type: await loadType(trx, s.typeId),
        lamps: body.lampsFitted,
        fuse: body.fuseFitted,
        at,
      })
      // Up on its fixing either way; only a passed record lets it go in service (season.ts).
      await trx('strings')
        .where({ id: s.id })
        .update({
          seasonState: 'installed',
          structureId: structureId ?? null,
          mountingHeightM: body.mountingHeightM,
          installedOn: day,
          storeBin: null,
        })
      await syncSeasonItemsOf(trx, s.siteId, at)
      return { id, visitId, kind: 'commissioning', ...judged, seasonState: 'installed' }
    },
  })
}

/** The same readings in store: a pass clears a taken-down or repaired string back to `in_store`. */
export async function recordStoreInspection(
  db: Db,
  user: Author,
  key: string,
  stringId: number,
  body: StoreInspectionBody,
): Promise<{ created: boolean; result: CommissioningResult }> {
  let s: SeasonString
  return writeOnce(db, {
    index: 'commissionings_idempotency_key_unique',
    lock: async (trx) => (s = await lockString(trx, stringId)),
    replay: (trx) => replay(trx, key),
    create: async (trx) => {
      if (!['in_store', 'taken_down', 'needs_repair'].includes(s.seasonState))
        throw conflict(
          'not_in_store',
          `${s.assetTag} is up on the street: take it down before a store inspection.`,
        )
      const at = body.doneAt ? new Date(body.doneAt) : new Date()
      const readings = await withCircuit(trx, s, body.readings)
      const judged = judgeSeasonTest([...readingFindings(readings), ...lampsOutFindings(body.lampsOut)])
      const visitId = await insertSeasonVisit(trx, user, s, 'store_inspection', at, body)
      const [id] = await trx('commissionings').insert({
        idempotencyKey: key,
        kind: 'store_inspection',
        stringId: s.id,
        visitId,
        userId: user.id,
        crewId: user.crewId,
        doneAt: at,
        readings: JSON.stringify(readings),
        lampsOut: body.lampsOut,
        result: judged.result,
        findings: JSON.stringify(judged.findings),
        notes: body.notes ?? null,
      })
      const seasonState = passed(judged.result) ? 'in_store' : 'needs_repair'
      await trx('strings').where({ id: s.id }).update({ seasonState })
      if (seasonState === 'in_store')
        await trx('takeDowns').where({ stringId: s.id }).whereNull('clearedById').update({ clearedById: id })
      await syncSeasonItemsOf(trx, s.siteId, at)
      return { id, visitId, kind: 'store_inspection', ...judged, seasonState }
    },
  })
}
