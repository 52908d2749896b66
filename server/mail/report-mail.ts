// E-mail to a member of the public who gave an address with a fault report: an acknowledgement
// with the reference and a status link, and a "fixed" message. Each carries a one-time link that
// erases the address; only a hash of its token is kept (report_email_tokens).
import { randomBytes } from 'node:crypto'
import type { Db } from '../db'
import type { Config } from '../config'
import type { MailMessage } from './mailer'
import { mailClock, renderMail } from './templates'
import { publicLink } from '../public-url'
import { hashToken } from '../services/users'
import { clientZone } from '../services/zones'

export type ReportMailKind = 'received' | 'fixed'

export interface ReportForMail {
  id: number
  ref: string
  email: string
  street: string | null
  createdAt: Date
  clientId: number | null
}

export const reportTopics: Record<ReportMailKind, string> = {
  received: 'report_received',
  fixed: 'report_fixed',
}

/** The public status page for `ref`; with `token`, the same page offering to erase the address. */
export function reportLinks(config: Config, ref: string, token: string) {
  const status = publicLink(config, '/report', { ref })
  return { status, erase: `${status}&erase=${encodeURIComponent(token)}` }
}

/** Renders one message; dates in the zone of the client whose lights they are. */
export function reportMail(
  config: Config,
  kind: ReportMailKind,
  r: ReportForMail,
  token: string,
  zone: string | null,
  at: Date,
): MailMessage {
  const clock = mailClock(config, zone)
  const subject =
    kind === 'received' ? `We have your fault report ${r.ref}` : `Fixed: your fault report ${r.ref}`
  const parts = renderMail(config, `report-${kind}`, subject, {
    ref: r.ref,
    street: r.street,
    sent: clock.dateTime(r.createdAt),
    at: clock.dateTime(at),
    ...reportLinks(config, r.ref, token),
  })
  return { to: r.email, ...parts, topic: reportTopics[kind] }
}

/**
 * Writes the message to the outbox in the caller's transaction (so it goes only if the change that
 * caused it commits) with its erase token; the mail-retry job, or `mailer.deliverDue({ ids })` after
 * the commit, sends it. Returns the outbox row's id.
 */
export async function queueReportMail(
  db: Db,
  config: Config,
  kind: ReportMailKind,
  r: ReportForMail,
  now: Date,
): Promise<number> {
  const token = randomBytes(24).toString('base64url')
  await db('reportEmailTokens').insert({ reportId: r.id, tokenHash: hashToken(token), createdAt: now })
  const msg = reportMail(config, kind, r, token, await clientZone(db, r.clientId, config.APP_TIME_ZONE), now)
  const [id] = await db('emailOutbox').insert({
    toAddress: msg.to,
    subject: msg.subject,
    text: msg.text,
    html: msg.html ?? null,
    topic: msg.topic,
    state: 'queued',
    attempts: 0,
    nextAttemptAt: now,
  })
  return id as number
}
