import type { Db } from '../db'
import { badRequest } from '../errors'
import { judgeReadings } from '../../shared/test-limits'
import type { z } from 'zod'
import type { certificateBody } from '../../shared/schemas/certificates'
import { syncCertificateItems } from './queue/certificates'
import { isoDay } from '../../shared/iso-time'

const DAY = 86_400_000

async function subjectLabels(db: Db) {
  const map = new Map<string, string>()
  for (const p of await db('platforms').select('id', 'assetTag', 'name'))
    map.set(`platform:${p.id}`, `${p.assetTag} ${p.name}`)
  for (const s of await db('structures as st')
    .join('sites as si', 'si.id', 'st.siteId')
    .select('st.id', 'st.ref', 'st.kind', 'si.name'))
    map.set(`structure:${s.id}`, `${s.ref} (${s.kind}, ${s.name})`)
  for (const c of await db('circuits').select('id', 'ref')) map.set(`circuit:${c.id}`, `Circuit ${c.ref}`)
  return map
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
    readings: typeof r.readings === 'string' ? JSON.parse(r.readings) : (r.readings ?? null),
    notes: r.notes ?? null,
    daysToDue: r.nextDue
      ? Math.round((Date.parse(`${r.nextDue}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / DAY)
      : null,
  }))
}

/** Records a test or inspection and brings the queue's certificate items in step; run it in a transaction. */
export async function recordCertificate(db: Db, userId: number, body: z.infer<typeof certificateBody>) {
  const table = { platform: 'platforms', structure: 'structures', string: 'strings', circuit: 'circuits' }[
    body.subjectType
  ]
  if (!(await db(table).where({ id: body.subjectId }).first('id')))
    throw badRequest('unknown_subject', `No ${body.subjectType} with id ${body.subjectId}.`)
  const judged = judgeReadings(body.kind, body.readings ?? {})
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
    readings: body.readings ? JSON.stringify(body.readings) : null,
    notes: [body.notes, ...(judged?.reasons ?? [])].filter(Boolean).join(' ') || null,
    createdBy: userId,
  })
  await syncCertificateItems(db, new Date())
  return { id, result, reasons: judged?.reasons ?? [] }
}
