// Outgoing e-mail: every message is written to email_outbox first, then handed to nodemailer (the
// local mail fake in development, a real SMTP server when SMTP_URL is set). A failed send is kept and
// retried with backoff by the mail-retry job (server/mail/outbox.ts); the action that wrote it still succeeds.
import nodemailer, { type Transporter } from 'nodemailer'
import type { Db } from '../db'
import { logger } from '../logger'
import { attempt, deliverDue, insertClaimed, type DeliveryRound, type MailTransport } from './outbox'

export interface MailMessage {
  to: string
  subject: string
  text: string
  html?: string
  topic: string
}

export interface SendOptions {
  /**
   * Answer once the message is in the outbox and make the first attempt after: the caller's timing
   * then says nothing about the message (a password reset must not reveal which addresses have accounts).
   */
  background?: boolean
}

export interface Mailer {
  send(msg: MailMessage, opts?: SendOptions): Promise<{ id: number; sent: boolean }>
  /**
   * Attempts the messages that are due (retries, lapsed claims), or only `ids`. Absent on stand-in
   * mailers that send nothing (benchmarks).
   */
  deliverDue?(opts?: { ids?: number[] }): Promise<DeliveryRound>
}

export function createTransport(smtpUrl: string | undefined, fakePort: number): Transporter {
  if (smtpUrl) return nodemailer.createTransport(smtpUrl)
  return nodemailer.createTransport({ host: '127.0.0.1', port: fakePort, secure: false, ignoreTLS: true })
}

export function createMailer(
  db: Db,
  transport: MailTransport,
  from: string,
  opts: { now?: () => Date } = {},
): Mailer {
  const now = opts.now ?? (() => new Date())
  return {
    async send(msg, sendOpts = {}) {
      const at = now()
      const { id, claim } = await insertClaimed(db, msg, at)
      const row = { id, toAddress: msg.to, ...msg, html: msg.html ?? null, attempts: 0 }
      const first = attempt(db, transport, from, row, claim, at)
      if (sendOpts.background) {
        first.catch((err: unknown) => logger.error({ err, id }, 'mail: first attempt not recorded'))
        return { id, sent: false }
      }
      return { id, sent: (await first) === 'sent' }
    },
    deliverDue: (o = {}) => deliverDue(db, transport, from, { now: now(), ids: o.ids }),
  }
}
