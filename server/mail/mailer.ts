// Outgoing e-mail: every message is recorded in email_outbox, then handed to nodemailer
// (the local mail fake in development, a real SMTP server when SMTP_URL is set).
import nodemailer, { type Transporter } from 'nodemailer'
import type { Db } from '../db'

export interface MailMessage {
  to: string
  subject: string
  text: string
  html?: string
  topic: string
}

export interface Mailer {
  send(msg: MailMessage): Promise<{ id: number; sent: boolean }>
}

export function createTransport(smtpUrl: string | undefined, fakePort: number): Transporter {
  if (smtpUrl) return nodemailer.createTransport(smtpUrl)
  return nodemailer.createTransport({ host: '127.0.0.1', port: fakePort, secure: false, ignoreTLS: true })
}

export function createMailer(db: Db, transport: Transporter, from: string): Mailer {
  return {
    async send(msg) {
      const [id] = await db('emailOutbox').insert({
        toAddress: msg.to,
        subject: msg.subject,
        text: msg.text,
        html: msg.html ?? null,
        topic: msg.topic,
        state: 'queued',
      })
      try {
        await transport.sendMail({ from, to: msg.to, subject: msg.subject, text: msg.text, html: msg.html })
        await db('emailOutbox').where({ id }).update({ state: 'sent', sentAt: new Date(), attempts: 1 })
        return { id, sent: true }
      } catch (err) {
        // Kept in the outbox as failed; the action that wrote it still succeeds.
        await db('emailOutbox')
          .where({ id })
          .update({ state: 'failed', attempts: 1, lastError: String((err as Error).message).slice(0, 500) })
        return { id, sent: false }
      }
    },
  }
}
