import { createHash, randomBytes, randomInt } from 'node:crypto'
import type { z } from 'zod'
import type { Db } from '../db'
import type { Config } from '../config'
import { notFound } from '../errors'
import type { reportBody } from '../../shared/schemas/reports'
import { reportStateLabel, type ReportState } from '../../shared/vocab/reports'
import { openReportItems } from './queue/reports'
import { writeOnce } from './keyed-write'
import { iso } from '../../shared/iso-time'
import { queueReportMail } from '../mail/report-mail'
import { looksAutomated } from './report-guards'
import { issuePhotoKey } from './report-photos'

// Crockford-style alphabet without I, L, O, U: easy to read out over the phone.
const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ'
const newRef = () => `LW-${Array.from({ length: 5 }, () => ALPHABET[randomInt(ALPHABET.length)]).join('')}`

type ReportBody = z.infer<typeof reportBody>

/**
 * Records a public report, opens or joins its queue item and queues the acknowledgement e-mail, all in
 * one commit; returns the outbox id to send after it. The form's Idempotency-Key, when sent, makes a
 * repeated send (the answer was lost) return the first report instead of a second. A sender that
 * looks automated (report-guards.ts) gets the same-looking answer and nothing is stored. The answer
 * carries a one-time `photoKey` for sending one photo with the report (report-photos.ts).
 */
export async function createReport(
  db: Db,
  config: Config,
  body: ReportBody,
  sourceIp: string,
  key: string | null = null,
  now = new Date(),
) {
  if (looksAutomated(body, now)) {
    const photoKey = randomBytes(24).toString('base64url')
    return { created: true, report: { ...decoyStatus(now), photoKey }, mailId: null }
  }
  let mailId: number | null = null
  const { created, result: ref } = await writeOnce(db, {
    index: 'reports_idempotency_key_unique',
    replay: async (trx) => {
      if (!key) return undefined
      const first = await trx('reports').where({ idempotencyKey: key }).first('ref')
      return first?.ref as string | undefined
    },
    create: async (trx) => {
      const report = await insertReport(trx, body, sourceIp, key, now)
      await trx('reportEvents').insert({ reportId: report.id, state: 'received', at: now, publicNote: null })
      await openReportItems(trx, now, [report.id])
      if (body.email) {
        const item = await trx('reports as r')
          .leftJoin('queueItems as q', 'q.id', 'r.queueItemId')
          .where('r.id', report.id)
          .first('q.clientId')
        mailId = await queueReportMail(
          trx,
          config,
          'received',
          {
            ...report,
            email: body.email,
            street: report.street,
            createdAt: now,
            clientId: item?.clientId ?? null,
          },
          now,
        )
      }
      return report.ref
    },
  })
  // A fresh one-time key for the report's photo on each answer (a repeat's replaces the lost one's).
  const stored = await db('reports').where({ ref }).first('id')
  const photoKey = await issuePhotoKey(db, stored.id)
  return { created, report: { ...(await reportStatus(db, ref)), photoKey }, mailId }
}

async function insertReport(db: Db, body: ReportBody, sourceIp: string, key: string | null, now: Date) {
  const s = body.tag
    ? await db('strings').where({ assetTag: body.tag.toUpperCase() }).first('id', 'lat', 'lng', 'siteId')
    : null
  const site = s ? await db('sites').where({ id: s.siteId }).first('name') : null
  let ref = newRef()
  while (await db('reports').where({ ref }).first('id')) ref = newRef()
  const street = body.street ?? site?.name ?? null
  const [id] = await db('reports').insert({
    ref,
    stringId: s?.id ?? null,
    tagText: body.tag ?? null,
    streetText: street,
    landmark: body.landmark ?? null,
    description: body.description,
    hazard: body.hazard,
    lat: body.lat ?? s?.lat ?? null,
    lng: body.lng ?? s?.lng ?? null,
    reporterName: body.name ?? null,
    reporterEmail: body.email ?? null,
    sourceHash: createHash('sha256').update(sourceIp).digest('hex'),
    idempotencyKey: key,
    createdAt: now,
    updatedAt: now,
  })
  return { id: id as number, ref, street: street as string | null }
}

/** The answer a robot gets: shaped like a real one, with a reference that was never stored. */
function decoyStatus(now: Date) {
  const at = iso(now)
  return {
    ref: newRef(),
    state: 'received' as const,
    stateLabel: reportStateLabel.received,
    street: null,
    createdAt: at,
    updatedAt: at,
    publicNote: null,
    history: [{ state: 'received' as const, stateLabel: reportStateLabel.received, at, publicNote: null }],
  }
}

/** What the reference shows to anyone who has it: the state and its history, nothing personal. */
export async function reportStatus(db: Db, ref: string) {
  const r = await db('reports')
    .where({ ref })
    .first('id', 'ref', 'state', 'streetText', 'createdAt', 'updatedAt', 'publicNote')
  if (!r) throw notFound('Report')
  const events = await db('reportEvents')
    .where({ reportId: r.id })
    .orderBy([{ column: 'at' }, { column: 'id' }])
    .select('state', 'at', 'publicNote')
  // Reports stored without history (the demo seed) show when they were sent and where they are now.
  const rows = events.length
    ? events
    : [
        { state: 'received', at: r.createdAt, publicNote: null },
        ...(r.state === 'received' ? [] : [{ state: r.state, at: r.updatedAt, publicNote: r.publicNote }]),
      ]
  return {
    ref: r.ref,
    state: r.state as ReportState,
    stateLabel: reportStateLabel[r.state as ReportState],
    street: r.streetText ?? null,
    createdAt: iso(r.createdAt),
    updatedAt: iso(r.updatedAt),
    publicNote: r.publicNote ?? null,
    history: rows.map((e) => ({
      state: e.state as ReportState,
      stateLabel: reportStateLabel[e.state as ReportState],
      at: iso(e.at),
      publicNote: e.publicNote ?? null,
    })),
  }
}

export async function listStreets(db: Db) {
  const rows = await db('sites as s')
    .join('clients as c', 'c.id', 's.clientId')
    .orderBy('s.name')
    .select('s.name', 'c.name as client')
  return rows.map((r) => ({ name: r.name, client: r.client }))
}
