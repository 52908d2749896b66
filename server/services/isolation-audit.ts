import type { Knex } from 'knex'
import type { Db } from '../db'
import { badRequest, notFound } from '../errors'
import type { Finding, IsolationAudit, IsolationQuery } from '../../shared/schemas/isolations'
import { REVIEW_NOTE_MIN } from '../../shared/vocab/isolations'
import { isolationFindings } from './isolation-findings'
import { noticeIsolationRejected } from './notice-producers'
import { iso, isoOrNull } from '../../shared/iso-time'
import { addDays, localInstant } from '../../shared/local-time'
import { config } from '../config'

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

type Step = IsolationAudit['steps'][number]

interface Judged {
  id: number
  startedAt: number
  steps: Step[]
  findings: Finding[]
  /** 0 a serious finding, 1 minor ones only, 2 none. */
  rank: number
}

const rankOf = (f: Finding[]) => (f.some((x) => x.severity === 'serious') ? 0 : f.length ? 1 : 2)

/**
 * The isolation records for sign-off. Findings are worked out from the stamped steps on every read
 * (so a new rule reaches old records too), which is why the filter, the severity order and the
 * paging happen here after the findings, not in SQL: a light pass over every record in the review
 * filter, then the full rows of one page.
 */
export async function listIsolationAudits(db: Db, q: IsolationQuery, zone = config.APP_TIME_ZONE) {
  if (q.from && q.to && q.from > q.to)
    throw badRequest(
      'date_range_reversed',
      `The period starts (${q.from}) after it ends (${q.to}): swap the dates.`,
      {
        from: q.from,
        to: q.to,
      },
    )
  const inReview = (b: Knex.QueryBuilder) => {
    if (q.review !== 'all') b.where('i.review', q.review)
    // Days as a person reads them: midnight to midnight on the app's clock.
    if (q.from) b.where('i.startedAt', '>=', localInstant(q.from, '00:00', zone))
    if (q.to) b.where('i.startedAt', '<', localInstant(addDays(q.to, 1), '00:00', zone))
  }
  const heads = (await db('isolations as i')
    .modify(inReview)
    .select('i.id', 'i.state', 'i.lockId', 'i.testerId', 'i.startedAt')) as Pick<
    Row,
    'id' | 'state' | 'lockId' | 'testerId' | 'startedAt'
  >[]
  const steps = await db('isolationSteps as st')
    .join('isolations as i', 'i.id', 'st.isolationId')
    .modify(inReview)
    .orderBy('st.doneAt')
    .select('st.isolationId', 'st.step', 'st.doneAt', 'st.value')
  const byRecord = new Map<number, Step[]>()
  for (const s of steps) {
    const list = byRecord.get(s.isolationId) ?? []
    list.push({ step: s.step, doneAt: iso(s.doneAt), value: s.value ?? null })
    byRecord.set(s.isolationId, list)
  }
  const judged: Judged[] = heads.map((h) => {
    const mine = byRecord.get(h.id) ?? []
    const findings = isolationFindings({
      state: h.state,
      lockId: h.lockId ?? null,
      testerId: h.testerId ?? null,
      steps: mine,
    })
    return { id: h.id, startedAt: +new Date(h.startedAt), steps: mine, findings, rank: rankOf(findings) }
  })
  const counts = {
    all: judged.length,
    any: judged.filter((j) => j.rank < 2).length,
    serious: judged.filter((j) => j.rank === 0).length,
  }
  const kept = judged.filter((j) =>
    q.findings === 'any' ? j.rank < 2 : q.findings === 'serious' ? j.rank === 0 : true,
  )
  kept.sort(
    (a, b) => (q.sort === 'severity' ? a.rank - b.rank : 0) || b.startedAt - a.startedAt || b.id - a.id,
  )
  const page = kept.slice((q.page - 1) * q.pageSize, q.page * q.pageSize)
  return {
    items: await fullRecords(db, page),
    total: kept.length,
    page: q.page,
    pageSize: q.pageSize,
    counts,
    withoutIsolation: await workWithoutIsolation(db),
  }
}

/** The page's records with names joined in, in the page's order. */
async function fullRecords(db: Db, page: Judged[]): Promise<IsolationAudit[]> {
  if (!page.length) return []
  const rows = (await db('isolations as i')
    .join('users as u', 'u.id', 'i.userId')
    .leftJoin('users as rv', 'rv.id', 'i.reviewedBy')
    .leftJoin('crews as c', 'c.id', 'i.crewId')
    .leftJoin('strings as s', 's.id', 'i.stringId')
    .whereIn(
      'i.id',
      page.map((j) => j.id),
    )
    .select(
      'i.*',
      'u.name as userName',
      'rv.name as reviewerName',
      'c.name as crewName',
      's.assetTag',
      's.name as stringName',
    )) as Row[]
  const byId = new Map(rows.map((r) => [r.id, r]))
  return page.flatMap((j) => {
    const r = byId.get(j.id)
    if (!r) return []
    return [
      {
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
        steps: j.steps,
        findings: j.findings,
      },
    ]
  })
}

/** Relamps and fuse changes logged with no isolation record: the reason the crew gave, newest first. */
async function workWithoutIsolation(db: Db) {
  const without = await db('visits as v')
    .join('users as u', 'u.id', 'v.userId')
    .join('strings as s', 's.id', 'v.stringId')
    .whereNull('v.isolationId')
    .where((w) => w.where('v.replaced', '>', 0).orWhere('v.fuseReplaced', true))
    .orderBy('v.visitedAt', 'desc')
    .limit(50)
    .select('v.id', 'v.visitedAt', 's.assetTag', 'u.name', 'v.noIsolationReason')
  return without.map((v) => ({
    visitId: v.id,
    visitedAt: iso(v.visitedAt),
    assetTag: v.assetTag,
    userName: v.name,
    reason: v.noIsolationReason ?? null,
  }))
}

export async function reviewIsolation(
  db: Db,
  id: number,
  reviewerId: number,
  decision: 'approved' | 'rejected',
  note?: string,
) {
  const head = await db('isolations')
    .where({ id })
    .first('id', 'state', 'lockId', 'testerId', 'userId', 'stringId', 'review')
  if (!head) throw notFound('Isolation')
  if (decision === 'approved' && (note ?? '').length < REVIEW_NOTE_MIN) {
    const steps = await db('isolationSteps').where({ isolationId: id }).select('step', 'doneAt', 'value')
    const findings = isolationFindings({
      state: head.state,
      lockId: head.lockId ?? null,
      testerId: head.testerId ?? null,
      steps: steps.map((s) => ({ step: s.step, doneAt: iso(s.doneAt), value: s.value ?? null })),
    })
    if (rankOf(findings) === 0)
      throw badRequest(
        'approval_note_required',
        'This record has a serious finding: say in the note why it can still be approved.',
        { fields: [{ path: 'note', message: 'Say why it can still be approved.' }] },
      )
  }
  const n = await db('isolations')
    .where({ id })
    .update({ review: decision, reviewNote: note ?? null, reviewedBy: reviewerId, reviewedAt: new Date() })
  if (!n) throw notFound('Isolation')
  if (decision === 'rejected' && head.review !== 'rejected') await noticeIsolationRejected(db, head, note)
}
