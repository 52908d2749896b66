import type { Db } from '../db'
import { conflict, notFound } from '../errors'
import { iso, isoOrNull } from '../../shared/iso-time'
import type { OutboxMessage } from '../../shared/schemas/mail-outbox'

/** The local mail fake's catch (demo mode). */
export async function listMail(db: Db) {
  const rows = await db('caughtMail')
    .select('id', 'toAddress', 'subject', 'receivedAt')
    .orderBy('id', 'desc')
    .limit(200)
  return rows.map((r) => ({
    id: r.id,
    to: r.toAddress ?? '',
    subject: r.subject ?? '',
    createdAt: iso(r.receivedAt),
  }))
}

export async function getMail(db: Db, id: number) {
  const r = await db('caughtMail').where({ id }).first()
  if (!r) throw notFound('Message')
  return {
    id: r.id,
    to: r.toAddress ?? '',
    from: r.fromAddress ?? '',
    subject: r.subject ?? '',
    text: r.text ?? '',
    html: r.html ?? null,
    createdAt: iso(r.receivedAt),
  }
}

// The outbox as admins see it: never the body (reset and invitation links are in it).
const outboxColumns = [
  'id',
  'toAddress',
  'subject',
  'topic',
  'state',
  'attempts',
  'lastError',
  'nextAttemptAt',
  'lastAttemptAt',
  'createdAt',
  'sentAt',
] as const

function toOutboxMessage(r: Record<string, unknown>): OutboxMessage {
  return {
    id: Number(r.id),
    to: String(r.toAddress),
    subject: String(r.subject),
    topic: (r.topic as string | null) ?? null,
    state: r.state as OutboxMessage['state'],
    attempts: Number(r.attempts),
    lastError: (r.lastError as string | null) ?? null,
    nextAttemptAt: isoOrNull(r.nextAttemptAt),
    lastAttemptAt: isoOrNull(r.lastAttemptAt),
    createdAt: iso(r.createdAt),
    sentAt: isoOrNull(r.sentAt),
  }
}

/** Messages that failed for good, then those waiting to try again after a failure; newest first. */
export async function listFailingMail(db: Db): Promise<OutboxMessage[]> {
  const rows = await db('emailOutbox')
    .where({ state: 'failed' })
    .orWhere((q) => q.where({ state: 'queued' }).where('attempts', '>', 0))
    .select(...outboxColumns)
    .orderByRaw("state = 'failed' desc, id desc")
    .limit(200)
  return rows.map(toOutboxMessage)
}

export async function getOutboxMessage(db: Db, id: number): Promise<OutboxMessage> {
  const r = await db('emailOutbox')
    .where({ id })
    .first(...outboxColumns)
  if (!r) throw notFound('Message')
  return toOutboxMessage(r)
}

/**
 * Puts a failed (or waiting) message back in line with a fresh count of attempts, due now.
 * 409 mail_not_failed for a message that went or is being sent.
 */
export async function requeueMail(db: Db, id: number, now = new Date()): Promise<void> {
  const r = await db('emailOutbox').where({ id }).forUpdate().first('state')
  if (!r) throw notFound('Message')
  if (r.state !== 'failed' && r.state !== 'queued')
    throw conflict('mail_not_failed', 'This message has been sent or is being sent now.')
  await db('emailOutbox').where({ id }).update({ state: 'queued', attempts: 0, nextAttemptAt: now })
}
