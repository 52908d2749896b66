// The first admin of a real install: with DEMO_MODE=false and no active admin, ADMIN_EMAIL (and
// optionally ADMIN_PASSWORD) creates one at start-up. Never touches an existing admin.
import { setTimeout as sleep } from 'node:timers/promises'
import type { Db } from '../db'
import { SettingError, type Config } from '../config'
import type { Mailer } from '../mail/mailer'
import { inviteMail } from '../mail/templates'
import { publicLink } from '../public-url'
import { HttpError } from '../errors'
import { demoAccountsSetting } from './demo-settings'
import { acceptInvite, inviteUser } from './users'
import { audit } from './audit'

export type FirstAdmin =
  | { kind: 'demo' | 'exists' | 'missing' }
  | { kind: 'created'; id: number; email: string; link: string | null }

const activeAdmins = (db: Db) => db('users').where({ role: 'admin', active: true })

export async function ensureFirstAdmin(
  db: Db,
  config: Config,
  mailer: Mailer,
  attempt = 0,
): Promise<FirstAdmin> {
  if (config.DEMO_MODE) return { kind: 'demo' }
  if (await activeAdmins(db).first('id')) return { kind: 'exists' }
  const email = config.ADMIN_EMAIL
  if (!email) return { kind: 'missing' }
  const password = config.ADMIN_PASSWORD
  let made: Awaited<ReturnType<typeof inviteUser>> | null
  try {
    made = await db.transaction(async (trx) => {
      // Checked again under lock: two instances starting at once make one admin.
      if ((await activeAdmins(trx).forUpdate().select('id')).length) return null
      const invited = await inviteUser(trx, { name: 'Administrator', email, role: 'admin' })
      if (password) {
        await acceptInvite(trx, invited.token, password)
        // Setting the password is not a sign-in.
        await trx('users').where({ id: invited.user.id }).update({ lastSignInAt: null })
      }
      await audit(trx, {
        userId: null,
        action: 'create_first_admin',
        entity: 'user',
        entityId: invited.user.id,
        details: { email, password: password ? 'ADMIN_PASSWORD' : 'set-password link' },
      })
      return invited
    })
  } catch (err) {
    // Several API processes start at once: the one whose insert lost (a duplicate key, or the deadlock
    // victim of two inserts into an empty range) finds the winner's admin once it has committed.
    const code = (err as { code?: string }).code
    if ((code === 'ER_DUP_ENTRY' || code === 'ER_LOCK_DEADLOCK') && attempt < 5) {
      await sleep(200 * (attempt + 1))
      return ensureFirstAdmin(db, config, mailer, attempt + 1)
    }
    if (!(err instanceof HttpError && err.code === 'email_taken')) throw err
    if (await activeAdmins(db).first('id')) return { kind: 'exists' }
    throw new SettingError(
      `ADMIN_EMAIL ${email} belongs to a user who is not an active admin: set another e-mail and start again`,
    )
  }
  if (!made) return { kind: 'exists' }
  const base = { kind: 'created' as const, id: made.user.id, email }
  if (password) return { ...base, link: null }
  // Sent after the commit; the link is printed too, as mail may not be set up yet.
  await mailer.send(inviteMail(config, made.user, made.token, 'Lampwright set-up'))
  return { ...base, link: publicLink(config, '/accept-invite', { token: made.token }) }
}

/** The line start-up prints about the first admin, or null when there is nothing to say. */
export function firstAdminLine(r: FirstAdmin): string | null {
  if (r.kind === 'missing')
    return 'No admin yet: set ADMIN_EMAIL (and ADMIN_PASSWORD, 12+ characters) and start again to create the first admin.'
  if (r.kind !== 'created') return null
  if (!r.link) return `Created the first admin ${r.email} with the password from ADMIN_PASSWORD.`
  return `Created the first admin ${r.email}: set the password within 7 days at ${r.link} (also e-mailed).`
}

/** Active demo accounts outside demo mode: their password is published, so start-up warns. */
export async function activeDemoAccounts(db: Db): Promise<string[]> {
  const demo = await demoAccountsSetting(db)
  if (!demo) return []
  const rows = await db('users')
    .whereIn(
      'email',
      demo.accounts.map((a) => a.email),
    )
    .where({ active: true })
    .select('email')
  return rows.map((r) => String(r.email))
}
