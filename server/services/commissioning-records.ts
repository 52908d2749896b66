// Commissioning records and store inspections as the safety officer reads them, beside isolations.
import type { Db } from '../db'
import { iso } from '../../shared/iso-time'

const parse = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : (v ?? null))

export async function listCommissionings(
  db: Db,
  q: { stringId?: number; result?: 'pass' | 'advisory' | 'fail'; limit: number },
) {
  const b = db('commissionings as c')
    .join('strings as s', 's.id', 'c.stringId')
    .leftJoin('users as u', 'u.id', 'c.userId')
    .leftJoin('structures as st', 'st.id', 'c.structureId')
  if (q.stringId) b.where('c.stringId', q.stringId)
  if (q.result) b.where('c.result', q.result)
  const rows = await b
    .orderBy([
      { column: 'c.doneAt', order: 'desc' },
      { column: 'c.id', order: 'desc' },
    ])
    .limit(q.limit)
    .select(
      'c.id',
      'c.kind',
      'c.stringId',
      's.assetTag',
      's.name as stringName',
      'c.doneAt',
      'u.name as by',
      'st.ref as structureRef',
      'c.approvalNote',
      'c.place',
      'c.mountingHeightM',
      'c.lampsOut',
      'c.result',
      'c.findings',
      'c.readings',
      'c.visitId',
    )
  return {
    items: rows.map((r) => ({
      ...r,
      doneAt: iso(r.doneAt),
      by: r.by ?? null,
      structureRef: r.structureRef ?? null,
      approvalNote: r.approvalNote ?? null,
      place: r.place ?? null,
      mountingHeightM: r.mountingHeightM == null ? null : Number(r.mountingHeightM),
      findings: parse(r.findings) ?? [],
      readings: parse(r.readings),
      visitId: r.visitId ?? null,
    })),
  }
}
