// Helpers for the reporters-* tests: a string nobody has reported yet, the caught mail to an address,
// and the reference and erase token in a message's text.
import { randomInt, randomUUID } from 'node:crypto'
import type { TestApp } from './helpers'

export const newEmail = (): string => `reporter.${randomUUID().slice(0, 8)}@example.org`

/** The tag of a live string with no waiting public report, picked at random so tests stay apart. */
export async function freeString(t: TestApp): Promise<string> {
  const rows = await t
    .db('strings')
    .whereNull('archivedAt')
    .whereNotIn(
      'id',
      t
        .db('reports')
        .whereIn('state', ['received', 'in_hand', 'scheduled'])
        .whereNotNull('stringId')
        .select('stringId'),
    )
    .select('assetTag')
  if (!rows.length) throw new Error('no string without a waiting report')
  return rows[randomInt(rows.length)].assetTag as string
}

/** The `skip`-th caught message to `to` (the first attempt is made after the answer, so wait for it). */
export async function mailTo(t: TestApp, to: string, skip = 0) {
  for (let i = 0; i < 100; i++) {
    const mails = await t
      .db('caughtMail')
      .where({ toAddress: to })
      .orderBy('id')
      .select('subject', 'text', 'html')
    if (mails[skip]) return mails[skip] as { subject: string; text: string; html: string }
    await new Promise((r) => setTimeout(r, 50))
  }
  throw new Error(`no mail to ${to}`)
}

export const refOf = (text: string): string => /\/report\?ref=(LW-[0-9A-Z]{5})/.exec(text)![1]
export const tokenOf = (text: string): string => /&erase=([\w-]+)/.exec(text)![1]
