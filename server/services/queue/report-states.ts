// A public report's state moves only forward (received → in_hand → scheduled → fixed, or duplicate /
// not_ours), each move in the caller's transaction with a history row; a report that becomes fixed
// queues its "fixed" e-mail in the same commit. The queue service calls these where the change happens.
import type { Db } from '../../db'
import { config as appConfig, type Config } from '../../config'
import { reportOpenStates, type ReportState } from '../../../shared/vocab/reports'
import { queueReportMail } from '../../mail/report-mail'

const rank: Record<ReportState, number> = {
  received: 0,
  in_hand: 1,
  scheduled: 2,
  fixed: 3,
  not_ours: 3,
  duplicate: 3,
}

/** Queues the reporter's "fixed" e-mail for a report row (its outbox id). */
function queueFixedMail(
  db: Db,
  config: Config,
  r: {
    id: number
    ref: string
    reporterEmail: string
    streetText?: string | null
    createdAt: Date | string
    clientId?: number | null
  },
  at: Date,
) {
  const report = {
    id: r.id,
    ref: r.ref,
    email: r.reporterEmail,
    street: r.streetText ?? null,
    createdAt: new Date(r.createdAt),
    clientId: r.clientId ?? null,
  }
  return queueReportMail(db, config, 'fixed', report, at)
}

export interface MoveHow {
  /** Words for the public status page (a supervisor's, for not ours / duplicate). */
  publicNote?: string | null
  config?: Config
}

/**
 * Moves the waiting reports among `ids` to `state` when it is further on than where they are; returns
 * the ids moved and the outbox ids of the e-mails queued (send them after the commit, or the mail-retry
 * job will within a minute).
 */
export async function moveReports(
  db: Db,
  ids: number[],
  state: ReportState,
  now: Date,
  how: MoveHow = {},
): Promise<{ moved: number[]; mailIds: number[] }> {
  if (!ids.length) return { moved: [], mailIds: [] }
  const rows = await db('reports as r')
    .leftJoin('queueItems as q', 'q.id', 'r.queueItemId')
    .whereIn('r.id', ids)
    .whereIn('r.state', reportOpenStates)
    .forUpdate()
    .select('r.id', 'r.ref', 'r.state', 'r.reporterEmail', 'r.streetText', 'r.createdAt', 'q.clientId')
  const moving = rows.filter((r) => rank[state] > rank[r.state as ReportState])
  if (!moving.length) return { moved: [], mailIds: [] }
  const moved = moving.map((r) => r.id as number)
  const note = how.publicNote?.trim() ? how.publicNote.trim().slice(0, 500) : null
  await db('reports')
    .whereIn('id', moved)
    .update({ state, updatedAt: now, ...(note ? { publicNote: note } : {}) })
  await db('reportEvents').insert(moved.map((reportId) => ({ reportId, state, at: now, publicNote: note })))
  const mailIds: number[] = []
  if (state === 'fixed') {
    for (const r of moving.filter((m) => m.reporterEmail)) {
      mailIds.push(await queueFixedMail(db, how.config ?? appConfig, r, now))
    }
  }
  return { moved, mailIds }
}

/** The reports carried by these queue items: each item's own report and those linked to it. */
export async function reportsOfItems(db: Db, itemIds: number[]): Promise<number[]> {
  if (!itemIds.length) return []
  const rows = await db('reports')
    .whereIn('queueItemId', itemIds)
    .orWhereIn(
      'id',
      db('queueItems')
        .whereIn('id', itemIds)
        .where('kind', 'public_report')
        .whereNotNull('reportId')
        .select('reportId'),
    )
    .select('id')
  return rows.map((r) => r.id as number)
}

/**
 * What items.ts `settleReports` should do: the reports behind closing or merged items (linked ones
 * included) leave the waiting states for `state`, with history and the fixed e-mail.
 */
export async function settleReportsOfItems(
  db: Db,
  itemIds: number[],
  state: ReportState,
  now = new Date(),
  how: MoveHow = {},
) {
  return moveReports(db, await reportsOfItems(db, itemIds), state, now, how)
}

/** A supervisor has taken up these items (snoozed, planned on a draft run): their reports are in hand. */
export async function markReportsInHand(db: Db, itemIds: number[], now = new Date()) {
  return moveReports(db, await reportsOfItems(db, itemIds), 'in_hand', now)
}

/**
 * Runs just published: reports carried by an item on one of their stops, or on a string one of their
 * stops visits, are scheduled. Call it inside publishRuns's transaction, after the stops are written.
 */
export async function markReportsScheduled(db: Db, runIds: number[], now = new Date()) {
  if (!runIds.length) return { moved: [], mailIds: [] }
  const stops = db('runStops').whereIn('runId', runIds).whereNull('doneAt')
  const itemIds = (await stops.clone().whereNotNull('queueItemId').select('queueItemId')).map(
    (s) => s.queueItemId as number,
  )
  const onStrings = await db('reports')
    .whereIn('stringId', stops.clone().whereNotNull('stringId').select('stringId'))
    .whereIn('state', reportOpenStates)
    .select('id')
  const ids = [...new Set([...(await reportsOfItems(db, itemIds)), ...onStrings.map((r) => r.id as number)])]
  return moveReports(db, ids, 'scheduled', now)
}

/**
 * Reports moved on without a history row (by code that set the state directly, or by the demo seed)
 * get one at their last change, and the fixed e-mail if they were fixed and gave an address.
 */
export async function catchUpReportMoves(db: Db, config: Config = appConfig) {
  const rows = await db('reports as r')
    .leftJoin('queueItems as q', 'q.id', 'r.queueItemId')
    .whereNotIn('r.state', reportOpenStates)
    .whereNotExists(
      db('reportEvents as e')
        .whereRaw('e.report_id = r.id')
        .whereRaw('e.state = r.state')
        .select(db.raw('1')),
    )
    .select(
      'r.id',
      'r.ref',
      'r.state',
      'r.reporterEmail',
      'r.streetText',
      'r.createdAt',
      'r.updatedAt',
      'q.clientId',
    )
  if (!rows.length) return []
  await db('reportEvents').insert(
    rows.map((r) => ({ reportId: r.id, state: r.state, at: r.updatedAt, publicNote: null })),
  )
  const mailIds: number[] = []
  for (const r of rows.filter((x) => x.state === 'fixed' && x.reporterEmail))
    mailIds.push(await queueFixedMail(db, config, r, new Date(r.updatedAt)))
  return mailIds
}
