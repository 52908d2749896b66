// Abuse guards for the public report form without a hosted captcha: a honeypot field people never see,
// and a minimum time between opening the form and sending it. A sender caught by either gets an answer
// that looks like success (so it learns nothing) and nothing is stored, queued or mailed. The limit of
// reports per network address (rate-limits.ts) runs before both.
import type { Db } from '../db'
import { notFound } from '../errors'
import { hashToken } from './users'

/**
 * Common practice, no source: a person needs more than a few seconds to describe a fault; a script
 * posts at once. A phone clock ahead of ours gives a negative time, which is not held against it.
 */
export const MIN_FILL_MS = 3_000

export function looksAutomated(body: { website?: string; formStartedAt?: number }, now: Date): boolean {
  if (body.website?.trim()) return true
  if (body.formStartedAt === undefined) return false
  const took = now.getTime() - body.formStartedAt
  return took >= 0 && took < MIN_FILL_MS
}

/**
 * Erases the reporter's address (and name) from the report, when `token` is one e-mailed for it; mail
 * for it not yet sent is dropped and the copies of sent ones lose the address. Using a link twice
 * answers the same; a token of another report is 404. Run it in a transaction.
 */
export async function eraseReporterEmail(db: Db, ref: string, token: string): Promise<{ erased: boolean }> {
  const r = await db('reports as r')
    .join('reportEmailTokens as t', 't.reportId', 'r.id')
    .where({ 'r.ref': ref, 't.tokenHash': hashToken(token) })
    .forUpdate()
    .first('r.id', 'r.reporterEmail')
  if (!r) throw notFound('Report')
  if (!r.reporterEmail) return { erased: true }
  const mails = () =>
    db('emailOutbox')
      .whereIn('topic', ['report_received', 'report_fixed'])
      .where({ toAddress: r.reporterEmail })
      .where('subject', 'like', `%${ref}`)
  await mails().clone().whereIn('state', ['queued', 'failed']).delete()
  await mails()
    .clone()
    .update({ toAddress: 'erased', text: '(Erased at the reporter’s request.)', html: null })
  await db('reports').where({ id: r.id }).update({ reporterEmail: null, reporterName: null })
  return { erased: true }
}
