import type { Db } from '../db'
import { badRequest } from '../errors'
import { judgeReadings, type RcdType } from '../../shared/test-limits'
import type { z } from 'zod'
import type { certificateBody } from '../../shared/schemas/certificates'
import { syncCertificateItems } from './queue/certificates'
import { iso, isoDay } from '../../shared/iso-time'
import { subjectLabels } from './certificate-subjects'
import { latestDocuments } from './certificate-documents'
import { kindsForSubject } from '../../shared/vocab/certificates'

const DAY = 86_400_000

/** A circuit's facts that a test is judged by: nominal volts, RCD rating and type (null = general). */
async function circuitFacts(db: Db, ids?: number[]) {
  const q = db('circuits').select('id', 'supplyVolts', 'rcdMa', 'rcdType')
  if (ids) q.whereIn('id', ids)
  const map = new Map<number, { supplyVolts: number; rcdMa: number | null; rcdType: RcdType }>()
  for (const c of await q)
    map.set(c.id, {
      supplyVolts: Number(c.supplyVolts),
      rcdMa: c.rcdMa === null ? null : Number(c.rcdMa),
      rcdType: c.rcdType === 'S' ? 'S' : 'general',
    })
  return map
}

/** Stored readings as an object; a row written before a field existed simply lacks it. */
function storedReadings(raw: unknown): Record<string, unknown> | null {
  if (raw === null || raw === undefined) return null
  if (typeof raw !== 'string') return typeof raw === 'object' ? (raw as Record<string, unknown>) : null
  try {
    const parsed: unknown = JSON.parse(raw)
    return parsed && typeof parsed === 'object' ? (parsed as Record<string, unknown>) : null
  } catch {
    return null
  }
}

export async function listCertificates(
  db: Db,
  q: { kind?: string; due: string; limit: number },
  now = new Date(),
) {
  const today = isoDay(now)
  const soon = isoDay(now.getTime() + 30 * DAY)
  // The newest record per subject and kind is the one that counts.
  const b = db('certificates as c').whereRaw(
    'c.id = (select max(c2.id) from certificates c2 where c2.kind = c.kind and c2.subject_type = c.subject_type and c2.subject_id = c.subject_id)',
  )
  if (q.kind) b.where('c.kind', q.kind)
  if (q.due === 'overdue') b.where('c.nextDue', '<', today)
  if (q.due === 'soon') b.whereBetween('c.nextDue', [today, soon])
  if (q.due === 'failed') b.where('c.result', 'fail')
  const rows = await b.orderBy('c.nextDue').limit(q.limit).select('c.*')
  const labels = await subjectLabels(db)
  const circuits = await circuitFacts(db)
  const docs = await latestDocuments(
    db,
    rows.map((r) => r.id as number),
  )
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    subjectType: r.subjectType,
    subjectId: r.subjectId,
    subjectLabel: labels.get(`${r.subjectType}:${r.subjectId}`) ?? `${r.subjectType} ${r.subjectId}`,
    reference: r.reference ?? null,
    doneOn: r.doneOn,
    nextDue: r.nextDue ?? null,
    result: r.result,
    inspector: r.inspector ?? null,
    readings: storedReadings(r.readings),
    notes: r.notes ?? null,
    daysToDue: r.nextDue
      ? Math.round((Date.parse(`${r.nextDue}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / DAY)
      : null,
    circuit: r.subjectType === 'circuit' ? (circuits.get(r.subjectId) ?? null) : null,
    document: docs.has(r.id)
      ? {
          name: docs.get(r.id)!.originalName,
          contentType: docs.get(r.id)!.contentType,
          sizeBytes: docs.get(r.id)!.sizeBytes,
          uploadedAt: iso(docs.get(r.id)!.createdAt),
        }
      : null,
  }))
}

/** Records a test or inspection and brings the queue's certificate items in step; run it in a transaction. */
export async function recordCertificate(
  db: Db,
  userId: number,
  body: z.infer<typeof certificateBody>,
  now = new Date(),
) {
  const table = { platform: 'platforms', structure: 'structures', string: 'strings', circuit: 'circuits' }[
    body.subjectType
  ]
  if (!(await db(table).where({ id: body.subjectId }).first('id')))
    throw badRequest('unknown_subject', `No ${body.subjectType} with id ${body.subjectId}.`)
  if (!kindsForSubject[body.subjectType].includes(body.kind))
    throw badRequest(
      'kind_not_for_subject',
      `A ${body.subjectType} does not take this kind of test. Choose one of: ${kindsForSubject[body.subjectType].join(', ')}.`,
    )
  const readings = await withCircuitDefaults(db, body)
  const judged = judgeReadings(body.kind, readings ?? {})
  const result = judged?.result ?? body.result
  if (!result)
    throw badRequest('validation_failed', 'Give a result or readings that decide it.', {
      fields: [{ path: 'body.result', message: 'Required without readings.' }],
    })
  const [id] = await db('certificates').insert({
    kind: body.kind,
    subjectType: body.subjectType,
    subjectId: body.subjectId,
    reference: body.reference ?? null,
    doneOn: body.doneOn,
    nextDue: body.nextDue ?? null,
    result,
    inspector: body.inspector ?? null,
    readings: readings ? JSON.stringify(readings) : null,
    notes: [body.notes, ...(judged?.reasons ?? [])].filter(Boolean).join(' ') || null,
    createdBy: userId,
  })
  // The record and the work it causes (a failed test, a date coming due) in one commit.
  await syncCertificateItems(db, now)
  return { id, result, reasons: judged?.reasons ?? [], findings: judged?.findings ?? [] }
}

/**
 * A test on a circuit is judged by the circuit's own facts unless the readings say otherwise: the
 * RCD's type and rating for an RCD test, the nominal voltage for an insulation test. The filled-in
 * values are stored with the readings, so the record shows what it was judged against.
 */
async function withCircuitDefaults(db: Db, body: z.infer<typeof certificateBody>) {
  const r = body.readings
  if (body.subjectType !== 'circuit' || !r) return r
  const c = (await circuitFacts(db, [body.subjectId])).get(body.subjectId)
  if (!c) return r
  if (body.kind === 'rcd_test')
    return { ...r, rcdType: r.rcdType ?? c.rcdType, ratedMa: r.ratedMa ?? c.rcdMa ?? undefined }
  if (body.kind === 'insulation_test') return { ...r, circuitVolts: r.circuitVolts ?? c.supplyVolts }
  return r
}
