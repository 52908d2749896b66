import { createHash, randomInt } from 'node:crypto'
import type { Db } from '../db'
import { notFound } from '../errors'
import { reportStateLabel } from '../../shared/schemas/reports'
import type { z } from 'zod'
import type { reportBody } from '../../shared/schemas/reports'
import { refreshReportItems } from '../jobs/refresh-queue'

// Crockford-style alphabet without I, L, O, U: easy to read out over the phone.
const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ'
const newRef = () => `LW-${Array.from({ length: 5 }, () => ALPHABET[randomInt(ALPHABET.length)]).join('')}`
const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : String(d))

export async function createReport(db: Db, body: z.infer<typeof reportBody>, sourceIp: string) {
  const s = body.tag
    ? await db('strings').where({ assetTag: body.tag.toUpperCase() }).first('id', 'lat', 'lng', 'siteId')
    : null
  const site = s ? await db('sites').where({ id: s.siteId }).first('name') : null
  let ref = newRef()
  while (await db('reports').where({ ref }).first('id')) ref = newRef()
  await db('reports').insert({
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
  })
  await refreshReportItems(db, new Date())
  return reportStatus(db, ref)
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
