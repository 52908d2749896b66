// Delivery from the email_outbox table: each attempt is made by whoever holds the row's claim, and a
// failed attempt waits for the next one (backoff) until the attempts run out.
import { randomUUID } from 'node:crypto'
import type { Db } from '../db'

/** The part of a nodemailer transport the outbox uses; tests pass their own. */
export interface MailTransport {
  sendMail(mail: { from: string; to: string; subject: string; text: string; html?: string }): Promise<unknown>
}

// Waits after the 1st, 2nd, 3rd and 4th failed attempt (common practice, no source: quick retries
// for a blip, then wider gaps for an outage). The 5th failure is final: 1 + 5 + 15 + 60 = 81 minutes.
export const RETRY_MINUTES = [1, 5, 15, 60] as const
export const MAX_ATTEMPTS = RETRY_MINUTES.length + 1
/** A row claimed for sending is reclaimed after this long (a process that died mid-send). */
export const LEASE_MS = 15 * 60_000
/** Reset links are not kept in the outbox once the message has gone (or will never go). */
const SCRUBBED_TOPICS = new Set(['password_reset'])
const SCRUBBED_TEXT = '(Removed after sending: this message held a one-time link.)'

export interface OutboxRow {
  id: number
  toAddress: string
  subject: string
  text: string
  html: string | null
  topic: string | null
  attempts: number
}

export interface DeliveryRound {
  sent: number
  retrying: number
  failed: number
}

/** When to try again after `attempts` failed attempts; null when they have run out. */
export function nextAttemptAt(attempts: number, now: Date): Date | null {
  const wait = RETRY_MINUTES[attempts - 1]
  return attempts >= MAX_ATTEMPTS || wait === undefined ? null : new Date(now.getTime() + wait * 60_000)
}

/** A new row, already claimed by the caller, who makes the first attempt at once. */
export async function insertClaimed(
  db: Db,
  msg: { to: string; subject: string; text: string; html?: string; topic: string },
  now: Date,
): Promise<{ id: number; claim: string }> {
  const claim = randomUUID()
  const [id] = await db('emailOutbox').insert({
    toAddress: msg.to,
    subject: msg.subject,
    text: msg.text,
    html: msg.html ?? null,
    topic: msg.topic,
    state: 'sending',
    attempts: 0,
    claim,
    claimedUntil: new Date(now.getTime() + LEASE_MS),
    nextAttemptAt: now,
  })
  return { id, claim }
}

/**
 * Claims the due rows in one UPDATE, so two processes running this at once never take the same row:
 * queued rows whose next attempt has come, and rows whose claim has lapsed.
 */
export async function claimDue(
  db: Db,
  now: Date,
  opts: { ids?: number[]; limit?: number } = {},
): Promise<{ claim: string; rows: OutboxRow[] }> {
  const claim = randomUUID()
  const ids = opts.ids?.length ? opts.ids : null
  await db.raw(
    `UPDATE email_outbox SET state = 'sending', claim = ?, claimed_until = ?
     WHERE ((state = 'queued' AND (next_attempt_at IS NULL OR next_attempt_at <= ?))
        OR (state = 'sending' AND claimed_until < ?))
       ${ids ? `AND id IN (${ids.map(() => '?').join(',')})` : ''}
     ORDER BY id LIMIT ?`,
    [claim, new Date(now.getTime() + LEASE_MS), now, now, ...(ids ?? []), opts.limit ?? 50],
  )
  const rows: OutboxRow[] = await db('emailOutbox')
    .where({ claim, state: 'sending' })
    .select('id', 'toAddress', 'subject', 'text', 'html', 'topic', 'attempts')
    .orderBy('id')
  return { claim, rows }
}

/** One attempt at one claimed row; records the outcome only while the claim is still ours. */
export async function attempt(
  db: Db,
  transport: MailTransport,
  from: string,
  row: OutboxRow,
  claim: string,
  now: Date,
): Promise<'sent' | 'retrying' | 'failed'> {
  const attempts = row.attempts + 1
  const scrub = row.topic && SCRUBBED_TOPICS.has(row.topic) ? { text: SCRUBBED_TEXT, html: null } : {}
  const mine = () => db('emailOutbox').where({ id: row.id, claim })
  try {
    await transport.sendMail({
      from,
      to: row.toAddress,
      subject: row.subject,
      text: row.text,
      html: row.html ?? undefined,
    })
    await mine().update({ state: 'sent', sentAt: now, lastAttemptAt: now, attempts, claim: null, ...scrub })
    return 'sent'
  } catch (err) {
    const next = nextAttemptAt(attempts, now)
    await mine().update({
      state: next ? 'queued' : 'failed',
      attempts,
      nextAttemptAt: next,
      lastAttemptAt: now,
      lastError: String((err as Error)?.message ?? err).slice(0, 500),
      claim: null,
      claimedUntil: null,
      ...(next ? {} : scrub),
    })
    return next ? 'retrying' : 'failed'
  }
}

/** Claims and attempts every due message (or only `ids`), one at a time. */
export async function deliverDue(
  db: Db,
  transport: MailTransport,
  from: string,
  opts: { now: Date; ids?: number[]; limit?: number },
): Promise<DeliveryRound> {
  const { claim, rows } = await claimDue(db, opts.now, opts)
  const round: DeliveryRound = { sent: 0, retrying: 0, failed: 0 }
  for (const row of rows) round[await attempt(db, transport, from, row, claim, opts.now)]++
  return round
}
