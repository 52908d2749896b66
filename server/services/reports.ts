import { createHash, randomInt } from 'node:crypto'
import type { z } from 'zod'
import type { Db } from '../db'
import { notFound } from '../errors'
import { reportStateLabel, type reportBody } from '../../shared/schemas/reports'
import { openReportItems } from './queue/reports'
import { writeOnce } from './keyed-write'
import { iso } from '../../shared/iso-time'

// Crockford-style alphabet without I, L, O, U: easy to read out over the phone.
const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ'
const newRef = () => `LW-${Array.from({ length: 5 }, () => ALPHABET[randomInt(ALPHABET.length)]).join('')}`

type ReportBody = z.infer<typeof reportBody>

/**
 * Records a public report and opens its queue item in the same commit. The form's Idempotency-Key,
 * when sent, makes a repeated send (the answer was lost) return the first report instead of a second.
 */
export async function createReport(db: Db, body: ReportBody, sourceIp: string, key: string | null = null) {
  const { created, result: ref } = await writeOnce(db, {
    index: 'reports_idempotency_key_unique',
    replay: async (trx) => {
      if (!key) return undefined
      const first = await trx('reports').where({ idempotencyKey: key }).first('ref')
      return first?.ref as string | undefined
    },
    create: async (trx) => {
      const report = await insertReport(trx, body, sourceIp, key)
      await openReportItems(trx, new Date(), [report.id])
      return report.ref
    },
  })
  return { created, report: await reportStatus(db, ref) }
}

async function insertReport(db: Db, body: ReportBody, sourceIp: string, key: string | null) {
  const s = body.tag
    ? await db('strings').where({ assetTag: body.tag.toUpperCase() }).first('id', 'lat', 'lng', 'siteId')
    : null
  const site = s ? await db('sites').where({ id: s.siteId }).first('name') : null
  let ref = newRef()
  while (await db('reports').where({ ref }).first('id')) ref = newRef()
  const [id] = await db('reports').insert({
    ref,
    stringId: s?.id ?? null,
    tagText: body.tag ?? null,
    streetText: body.street ?? site?.name ?? null,
    landmark: body.landmark ?? null,
    description: body.description,
    hazard: body.hazard,
    lat: body.lat ?? s?.lat ?? null,
    lng: body.lng ?? s?.lng ?? null,
    reporterName: body.name ?? null,
    reporterEmail: body.email ?? null,
    sourceHash: createHash('sha256').update(sourceIp).digest('hex'),
    idempotencyKey: key,
  })
  return { id: id as number, ref }
}

export async function reportStatus(db: Db, ref: string) {
  const r = await db('reports')
    .where({ ref })
    .first('ref', 'state', 'streetText', 'createdAt', 'updatedAt', 'publicNote')
  if (!r) throw notFound('Report')
  return {
    ref: r.ref,
    state: r.state,
    stateLabel: reportStateLabel[r.state as keyof typeof reportStateLabel],
    street: r.streetText ?? null,
    createdAt: iso(r.createdAt),
    updatedAt: iso(r.updatedAt),
    publicNote: r.publicNote ?? null,
  }
}

export async function listStreets(db: Db) {
  const rows = await db('sites as s')
    .join('clients as c', 'c.id', 's.clientId')
    .orderBy('s.name')
    .select('s.name', 'c.name as client')
  return rows.map((r) => ({ name: r.name, client: r.client }))
}
