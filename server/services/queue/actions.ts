// What a supervisor does to queue items: snooze, wake early, merge duplicates, close without a visit. The routes
// run these inside audited(), so each change and its audit row commit together.
import { badRequest, conflict, notFound } from '../../errors'
import type { ReportClosedState } from '../../../shared/vocab/reports'
import { ACTIVE, closeItems } from './items'
import { markReportsInHand, settleReportsOfItems } from './report-states'
import type { Db } from '../../db'

async function openOrSnoozed(db: Db, id: number) {
  const item = await db('queueItems').where({ id }).first('id', 'state', 'kind')
  if (!item) throw notFound('Queue item')
  if (!(ACTIVE as readonly string[]).includes(item.state))
    throw badRequest('item_closed', 'This item is already closed or merged.')
  return item as { id: number; state: string; kind: string }
}

export async function snoozeItem(db: Db, id: number, until: Date, reason: string, now = new Date()) {
  await openOrSnoozed(db, id)
  if (until <= now)
    throw badRequest('validation_failed', 'Snooze until a time in the future.', {
      fields: [{ path: 'body.until', message: 'Must be in the future.' }],
    })
  await db('queueItems').where({ id }).update({ state: 'snoozed', snoozedUntil: until, snoozeReason: reason })
  // A supervisor has looked at it: a reporter's status page says the report is in hand.
  await markReportsInHand(db, [id], now)
}

/** A supervisor wakes a snoozed item before its time: it is open again now (409 if it is not snoozed). */
export async function wakeItem(db: Db, id: number) {
  const item = await db('queueItems').where({ id }).first('id', 'state')
  if (!item) throw notFound('Queue item')
  if (item.state !== 'snoozed') throw conflict('not_snoozed', 'This item is not snoozed.')
  await db('queueItems').where({ id }).update({ state: 'open', snoozedUntil: null, snoozeReason: null })
  return { id, state: 'open' as const }
}

/** Snoozed items whose time has come are open again. */
export async function wakeSnoozed(db: Db, now = new Date()) {
  await db('queueItems')
    .where('state', 'snoozed')
    .where('snoozedUntil', '<=', now)
    .update({ state: 'open', snoozedUntil: null })
}

/** Folds duplicates into one item; a public report merged away is marked already reported. */
export async function mergeItems(db: Db, into: number, ids: number[], now = new Date()) {
  if (ids.includes(into))
    throw badRequest('validation_failed', 'An item cannot be merged into itself.', {
      fields: [{ path: 'body.ids', message: 'Remove the target.' }],
    })
  await openOrSnoozed(db, into)
  for (const id of ids) await openOrSnoozed(db, id)
  await db('queueItems')
    .whereIn('id', ids)
    .update({ state: 'merged', mergedIntoId: into, openKey: null, closedAt: now })
  await settleReportsOfItems(db, ids, 'duplicate', now)
}

/**
 * Closes an item without a visit. The reason has its own column; a public report's status page says
 * `reportState` (fixed unless the supervisor says otherwise), so the report is not opened again.
 */
export async function closeItem(
  db: Db,
  id: number,
  reason: string,
  reportState?: ReportClosedState,
  now = new Date(),
) {
  const item = await openOrSnoozed(db, id)
  if (reportState && item.kind !== 'public_report')
    throw badRequest('validation_failed', 'Only a public-report item has a report to update.', {
      fields: [{ path: 'body.reportState', message: 'Leave it out for this kind of item.' }],
    })
  await closeItems(db, [id], { now, reason, reportState: reportState ?? 'fixed' })
}
