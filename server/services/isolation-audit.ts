import type { Db } from '../db'
import { notFound } from '../errors'
import type { IsolationAudit } from '../../shared/schemas/isolations'
import { isolationFindings } from './isolation-findings'
import { iso, isoOrNull } from '../../shared/iso-time'

interface Row {
  id: number
  stringId: number | null
  assetTag: string | null
  stringName: string | null
  crewName: string | null
  userName: string
  reviewerName: string | null
  lockId: string | null
  testerId: string | null
  state: IsolationAudit['state']
  review: IsolationAudit['review']
  reviewNote: string | null
  startedAt: Date
  completedAt: Date | null
}

export async function listIsolationAudits(db: Db, q: { review: string; limit: number }) {
  const rows = (await db('isolations as i')
    .join('users as u', 'u.id', 'i.userId')
    .leftJoin('users as rv', 'rv.id', 'i.reviewedBy')
    .leftJoin('crews as c', 'c.id', 'i.crewId')
    .leftJoin('strings as s', 's.id', 'i.stringId')
    .modify((b) => {
      if (q.review !== 'all') b.where('i.review', q.review)
    })
    .orderBy('i.startedAt', 'desc')
    .limit(q.limit)
    .select(
      'i.*',
      'u.name as userName',
      'rv.name as reviewerName',
      'c.name as crewName',
      's.assetTag',
      's.name as stringName',
    )) as Row[]
  const steps = rows.length
    ? await db('isolationSteps')
        .whereIn(
          'isolationId',
          rows.map((r) => r.id),
        )
        .orderBy('doneAt')
        .select('isolationId', 'step', 'doneAt', 'value')
    : []
  const items: IsolationAudit[] = rows.map((r) => {
    const mine = steps
      .filter((s) => s.isolationId === r.id)
      .map((s) => ({ step: s.step, doneAt: iso(s.doneAt), value: s.value ?? null }))
    const record = { state: r.state, lockId: r.lockId ?? null, testerId: r.testerId ?? null, steps: mine }
    return {
      id: r.id,
      stringId: r.stringId ?? null,
      assetTag: r.assetTag ?? null,
      stringName: r.stringName ?? null,
      crewName: r.crewName ?? null,
      userName: r.userName,
      lockId: r.lockId ?? null,
      testerId: r.testerId ?? null,
      state: r.state,
      review: r.review,
      reviewNote: r.reviewNote ?? null,
      reviewedBy: r.reviewerName ?? null,
      startedAt: iso(r.startedAt),
      completedAt: isoOrNull(r.completedAt),
      steps: mine,
      findings: isolationFindings(record),
    }
  })
  const without = await db('visits as v')
    .join('users as u', 'u.id', 'v.userId')
    .join('strings as s', 's.id', 'v.stringId')
    .whereNull('v.isolationId')
    .where((w) => w.where('v.replaced', '>', 0).orWhere('v.fuseReplaced', true))
    .orderBy('v.visitedAt', 'desc')
    .limit(50)
    .select('v.id', 'v.visitedAt', 's.assetTag', 'u.name', 'v.noIsolationReason')
  return {
    items,
    withoutIsolation: without.map((v) => ({
      visitId: v.id,
      visitedAt: iso(v.visitedAt),
      assetTag: v.assetTag,
      userName: v.name,
      reason: v.noIsolationReason ?? null,
    })),
  }
}

export async function reviewIsolation(
  db: Db,
  id: number,
  reviewerId: number,
  decision: 'approved' | 'rejected',
  note?: string,
) {
  const n = await db('isolations')
    .where({ id })
    .update({ review: decision, reviewNote: note ?? null, reviewedBy: reviewerId, reviewedAt: new Date() })
  if (!n) throw notFound('Isolation')
}
