// Sending an invitation again (users.ts makes and accepts them).
import type { Db } from '../db'
import { conflict, notFound } from '../errors'
import { getUser, newInvite } from './users'

/**
 * A fresh invitation for an active user who has not set a password yet: the old link stops working.
 * 409 invite_not_pending once the password is set (they use "Forgot your password?" instead).
 */
export async function renewInvite(db: Db, id: number, now = new Date()) {
  const u = await db('users').where({ id }).forUpdate().first('active', 'passwordHash')
  if (!u) throw notFound('User')
  if (!u.active) throw conflict('user_inactive', 'This user is deactivated. Reactivate them first.')
  if (u.passwordHash)
    throw conflict(
      'invite_not_pending',
      'This user has already set a password. They can use "Forgot your password?" on the sign-in page.',
    )
  const { token, ...invite } = newInvite(now)
  await db('users').where({ id }).update(invite)
  return { user: await getUser(db, id), token, expiresAt: invite.inviteExpiresAt }
}
