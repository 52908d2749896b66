// Access recovery without an admin: a one-time link, valid one hour, e-mailed to an active user.
// Only a hash of the token is stored; using it sets the password and ends every session.
import { randomBytes } from 'node:crypto'
import type { Response } from 'express'
import type { Db } from '../db'
import type { Config } from '../config'
import type { Mailer } from '../mail/mailer'
import { passwordResetMail } from '../mail/templates'
import { badRequest } from '../errors'
import { hashToken, setPassword, type SessionUser } from './users'
import { checkNewPassword } from './password-policy'
import { consume, normaliseEmail, type Limit } from './rate-limits'

/** OWASP Forgot Password Cheat Sheet: short-lived, single-use tokens; one hour here. */
export const RESET_MINUTES = 60

// Common practice, no source: room for a shared depot address, few mails to one inbox.
export const RESET_LIMITS = {
  address: {
    name: 'forgot-address',
    points: 10,
    seconds: 15 * 60,
    message: 'Too many password-reset requests from your network. Wait a few minutes and try again.',
  },
  email: { name: 'forgot-email', points: 3, seconds: 60 * 60, message: '' },
} satisfies Record<string, Limit>

const invalid = () =>
  badRequest(
    'reset_token_invalid',
    'This link is not valid any more: it has been used, has expired, or a newer one was sent. Ask for a new one.',
  )

/**
 * Counts the request (429 per network address), then, for an active user only, stores a new token,
 * ends the older unused ones and queues the mail, whose first attempt is made after the answer.
 * Too many requests for one address are dropped quietly: the answer never tells whether an account exists.
 */
export async function requestPasswordReset(
  deps: { db: Db; config: Config; mailer: Mailer },
  email: string,
  ip: string | undefined,
  res: Response,
  now = new Date(),
): Promise<void> {
  const { db } = deps
  await consume(db, RESET_LIMITS.address, ip ?? 'unknown', res)
  try {
    await consume(db, RESET_LIMITS.email, normaliseEmail(email), res)
  } catch {
    res.removeHeader('Retry-After')
    return
  }
  const user = await db('users')
    .where({ email: normaliseEmail(email), active: true })
    .first('id', 'name', 'email')
  if (!user) return
  const token = randomBytes(32).toString('base64url')
  const expiresAt = new Date(now.getTime() + RESET_MINUTES * 60_000)
  await db.transaction(async (trx) => {
    await trx('passwordResets').where({ userId: user.id }).whereNull('usedAt').update({ usedAt: now })
    await trx('passwordResets').insert({
      userId: user.id,
      tokenHash: hashToken(token),
      createdAt: now,
      expiresAt,
    })
  })
  await deps.mailer.send(passwordResetMail(deps.config, user, token, expiresAt), { background: true })
}

/**
 * Sets the password from a reset link; run it in a transaction (the token row is locked, so a link
 * used twice at once works once). 400 reset_token_invalid, password_too_short, password_too_common.
 */
export async function resetPassword(
  db: Db,
  token: string,
  password: string,
  now = new Date(),
): Promise<SessionUser> {
  const row = await db('passwordResets')
    .where({ tokenHash: hashToken(token) })
    .forUpdate()
    .first()
  if (!row || row.usedAt || new Date(row.expiresAt) <= now) throw invalid()
  const user = await db('users').where({ id: row.userId, active: true }).first('id', 'email')
  if (!user) throw invalid()
  checkNewPassword(password, user.email)
  await db('passwordResets').where({ id: row.id }).update({ usedAt: now })
  return setPassword(db, user.id, password)
}
