// The crew's log of an emergency (hazard report) stop: what they found, what they did, and whether it
// is made safe. Stored once per Idempotency-Key (the phone's outbox may send it twice); the log, the
// queue change (through the one queue service) and its audit row commit together.
//   fixed     — the item closes (closeItems) and its reports read "Fixed", with the fixed e-mail;
//   made_safe — no hazard left but more work needed: the item stays open as routine work (standard
//               severity, so it ranks by its score again) and its reports read "in hand";
//   not_safe  — still a hazard: the item stays open as an emergency and its reports read "in hand".
import type { Db } from '../db'
import { conflict, notFound } from '../errors'
import type { EmergencyLog, EmergencyLogBody } from '../../shared/schemas/report-work'
import { emergencyOutcomeLabel, type EmergencyOutcome } from '../../shared/vocab/report-work'
import { iso } from '../../shared/iso-time'
import { API_PREFIX } from '../openapi'
import { audit } from './audit'
import { writeOnce } from './keyed-write'
import { ACTIVE, closeItems } from './queue/items'
import { markReportsInHand } from './queue/report-states'

export const emergencyPhotoUrls = (id: number) => ({
  url: `${API_PREFIX}/emergency-logs/${id}/photo/file`,
  thumbUrl: `${API_PREFIX}/emergency-logs/${id}/photo/thumb`,
})

const columns = [
  'l.id',
  'l.queueItemId',
  'l.stringId',
  'u.name as by',
  'l.found',
  'l.did',
  'l.outcome',
  'l.loggedAt',
  'l.photoFile',
  'q.state as itemState',
  'q.closedAt',
] as const

function logs(db: Db) {
  return db('emergencyLogs as l')
    .leftJoin('users as u', 'u.id', 'l.userId')
    .leftJoin('queueItems as q', 'q.id', 'l.queueItemId')
    .select(...columns)
}

function toLog(r: Record<string, unknown>): EmergencyLog {
  const outcome = r.outcome as EmergencyOutcome
  return {
    id: r.id as number,
    itemId: (r.queueItemId as number | null) ?? null,
    stringId: (r.stringId as number | null) ?? null,
    by: (r.by as string | null) ?? null,
    found: r.found as string,
    did: r.did as string,
    outcome,
    outcomeLabel: emergencyOutcomeLabel[outcome],
    loggedAt: iso(r.loggedAt as Date),
    photo: r.photoFile ? emergencyPhotoUrls(r.id as number) : null,
    itemClosed: outcome === 'fixed' && r.itemState === 'closed',
  }
}

export async function emergencyLogsOfString(db: Db, stringId: number): Promise<EmergencyLog[]> {
  const rows = await logs(db).where('l.stringId', stringId).orderBy('l.loggedAt', 'desc').limit(50)
  return rows.map(toLog)
}

export interface Logger {
  id: number
  requestId?: string
}

/**
 * Records the log on queue item `itemId`. Only a public-report item that is (or was) an emergency
 * takes one (409 `not_emergency`). An item already closed (another crew logged it, a supervisor
 * closed it) still keeps the log: field work done is never refused.
 */
export async function logEmergency(
  db: Db,
  itemId: number,
  by: Logger,
  body: EmergencyLogBody,
  key: string,
  now = new Date(),
): Promise<{ created: boolean; result: EmergencyLog }> {
  const byKey = async (trx: Db) => {
    const row = await logs(trx).where('l.idempotencyKey', key).first()
    return row ? toLog(row) : undefined
  }
  return writeOnce(db, {
    index: 'emergency_logs_idempotency_key_unique',
    lock: (trx) => trx('queueItems').where({ id: itemId }).forUpdate().first('id'),
    replay: byKey,
    create: async (trx) => {
      const item = await trx('queueItems')
        .where({ id: itemId })
        .first('id', 'kind', 'severity', 'state', 'stringId')
      if (!item) throw notFound('Queue item')
      const loggedBefore = await trx('emergencyLogs').where({ queueItemId: itemId }).first('id')
      if (item.kind !== 'public_report' || (item.severity !== 'emergency' && !loggedBefore))
        throw conflict(
          'not_emergency',
          'Only an emergency (hazard report) stop is logged here; log a visit instead.',
        )
      const loggedAt = body.loggedAt ? new Date(body.loggedAt) : now
      const [id] = await trx('emergencyLogs').insert({
        queueItemId: itemId,
        stringId: item.stringId ?? null,
        userId: by.id,
        found: body.found,
        did: body.did,
        outcome: body.outcome,
        loggedAt,
        idempotencyKey: key,
        createdAt: now,
      })
      const open = (ACTIVE as readonly string[]).includes(item.state)
      if (open) await applyOutcome(trx, itemId, body.outcome, now)
      await audit(trx, {
        userId: by.id,
        action: 'emergency_log',
        entity: 'queue_item',
        entityId: itemId,
        details: { logId: id, outcome: body.outcome, itemWasOpen: open },
        requestId: by.requestId,
      })
      return (await byKey(trx))!
    },
  })
}

async function applyOutcome(trx: Db, itemId: number, outcome: EmergencyOutcome, now: Date) {
  // The crew has been: the stop on their run reads done unless the hazard is still there.
  if (outcome !== 'not_safe')
    await trx('runStops').where({ queueItemId: itemId }).whereNull('doneAt').update({ doneAt: now })
  if (outcome === 'fixed') {
    await closeItems(trx, [itemId], {
      now,
      reason: 'Emergency made safe and fixed by the crew (see the emergency log)',
      reportState: 'fixed',
    })
    return
  }
  await markReportsInHand(trx, [itemId], now)
  // The item stays open with the crew's word on it, read wherever its summary shows (queue, run, sheet).
  const item = await trx('queueItems').where({ id: itemId }).first('summary')
  const note =
    outcome === 'made_safe' ? 'made safe by the crew, needs more work' : 'crew attended, not yet safe'
  const summary = `${String(item.summary).replace(/ · (made safe by the crew|crew attended).*$/, '')} · ${note}`
  await trx('queueItems')
    .where({ id: itemId })
    .update({ summary: summary.slice(0, 255), ...(outcome === 'made_safe' ? { severity: 'standard' } : {}) })
}

/** The log's photo, once: a repeat (same log already has one) answers created: false. */
export async function attachEmergencyPhoto(
  db: Db,
  logId: number,
  names: { photoFile: string; photoThumb: string },
) {
  const updated = await db('emergencyLogs').where({ id: logId }).whereNull('photoFile').update(names)
  return updated === 1
}

export async function emergencyLogRow(db: Db, logId: number) {
  const row = await db('emergencyLogs').where({ id: logId }).first('id', 'userId', 'photoFile', 'photoThumb')
  if (!row) throw notFound('Emergency log')
  return row
}

export async function emergencyLogById(db: Db, logId: number): Promise<EmergencyLog> {
  const row = await logs(db).where('l.id', logId).first()
  if (!row) throw notFound('Emergency log')
  return toLog(row)
}
