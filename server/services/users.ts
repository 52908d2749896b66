import { createHash, randomBytes } from 'node:crypto'
import bcrypt from 'bcryptjs'
import type { Db } from '../db'
import type { Role } from '../../shared/roles'
import { badRequest, conflict, notFound } from '../errors'
import { isoOrNull } from '../../shared/iso-time'
import { checkNewPassword } from './password-policy'

// OWASP password storage guidance: bcrypt work factor of at least 10.
export const BCRYPT_COST = 11
const INVITE_DAYS = 7
let dummyHash: string | undefined

const userColumns = [
  'id',
  'name',
  'email',
  'role',
  'crewId',
  'active',
  'invitedAt',
  'lastSignInAt',
  'passwordHash',
] as const

export interface UserRow {
  id: number
  name: string
  email: string
  role: Role
  crewId: number | null
  active: boolean
  invitedAt: string | null
  lastSignInAt: string | null
  invitePending: boolean
}

function mapUser(r: Record<string, unknown>): UserRow {
  const { passwordHash, ...rest } = r
  return {
    ...(rest as unknown as UserRow),
    active: Boolean(r.active),
    invitedAt: isoOrNull(r.invitedAt),
    lastSignInAt: isoOrNull(r.lastSignInAt),
    invitePending: !passwordHash,
  }
}

export const hashToken = (t: string): string => createHash('sha256').update(t).digest('hex')

/** What a session needs: the public user and the token version its tokens must carry. */
export interface SessionUser {
  id: number
  name: string
  email: string
  role: Role
  crewId: number | null
  tokenVersion: number
}

const sessionColumns = ['id', 'name', 'email', 'role', 'crewId', 'tokenVersion'] as const

function toSession(u: Record<string, unknown>): SessionUser {
  return {
    id: Number(u.id),
    name: String(u.name),
    email: String(u.email),
    role: u.role as Role,
    crewId: (u.crewId as number | null) ?? null,
    tokenVersion: Number(u.tokenVersion ?? 0),
  }
}

export async function findActiveUser(db: Db, id: number): Promise<SessionUser | null> {
  const u = await db('users')
    .where({ id, active: true })
    .first(...sessionColumns)
  return u ? toSession(u) : null
}

/** The user when the password is right and the account active; null otherwise. Writes nothing. */
export async function verifyCredentials(db: Db, email: string, password: string) {
  const u = await db('users').where({ email }).first()
  // Compare against a fixed hash when the user is unknown so timing does not reveal accounts.
  dummyHash ??= await bcrypt.hash('no account has this password', BCRYPT_COST)
  const hash = u?.passwordHash ?? dummyHash
  const ok = await bcrypt.compare(password, hash)
  if (!u || !ok || !u.active || !u.passwordHash) return null
  return toSession(u)
}

export async function recordSignIn(db: Db, id: number): Promise<void> {
  await db('users').where({ id }).update({ lastSignInAt: new Date() })
}

/** Ends every session the user holds: tokens carrying the old version stop working. */
export async function revokeSessions(db: Db, id: number): Promise<SessionUser> {
  await db('users')
    .where({ id })
    .update({ tokenVersion: db.raw('token_version + 1') })
  const u = await db('users')
    .where({ id })
    .first(...sessionColumns)
  if (!u) throw notFound('User')
  return toSession(u)
}

/** The signed-in user's current password, checked before a change: 400 wrong_password otherwise. */
export async function checkPassword(db: Db, id: number, password: string): Promise<void> {
  const u = await db('users').where({ id }).first('passwordHash')
  if (!u?.passwordHash || !(await bcrypt.compare(password, u.passwordHash)))
    throw badRequest('wrong_password', 'The current password is not right.')
}

/**
 * A new password and a new token version: every session made with the old one ends. A pending
 * invitation ends too (a reset by an invited user sets their first password).
 */
export async function setPassword(db: Db, id: number, password: string): Promise<SessionUser> {
  const passwordHash = await bcrypt.hash(password, BCRYPT_COST)
  await db('users').where({ id }).update({ passwordHash, inviteTokenHash: null })
  return revokeSessions(db, id)
}

export async function listUsers(db: Db): Promise<UserRow[]> {
  const rows = await db('users')
    .select(...userColumns)
    .orderBy('name')
  return rows.map(mapUser)
}

export async function getUser(db: Db, id: number): Promise<UserRow> {
  const r = await db('users')
    .where({ id })
    .first(...userColumns)
  if (!r) throw notFound('User')
  return mapUser(r)
}

/** Creates an invited user; the caller sends the mail with the returned token and audits in its transaction. */
export async function inviteUser(
  db: Db,
  input: { name: string; email: string; role: Role; crewId?: number | null },
) {
  const exists = await db('users').where({ email: input.email }).first('id')
  if (exists) throw conflict('email_taken', 'A user with this e-mail already exists.')
  const { token, ...invite } = newInvite(new Date())
  const [id] = await db('users').insert({
    name: input.name,
    email: input.email,
    role: input.role,
    crewId: input.crewId ?? null,
    active: true,
    ...invite,
  })
  return { user: await getUser(db, id), token, expiresAt: invite.inviteExpiresAt }
}

/** A one-time invitation link: only its hash is stored. */
export function newInvite(now: Date) {
  const token = randomBytes(24).toString('base64url')
  const inviteExpiresAt = new Date(now.getTime() + INVITE_DAYS * 86_400_000)
  return { token, inviteTokenHash: hashToken(token), invitedAt: now, inviteExpiresAt }
}

/** Sets the password of a pending invitation; run it in a transaction (the row is locked). */
export async function acceptInvite(db: Db, token: string, password: string): Promise<SessionUser> {
  const u = await db('users')
    .where({ inviteTokenHash: hashToken(token), active: true })
    .forUpdate()
    .first()
  if (!u || new Date(u.inviteExpiresAt) < new Date()) {
    throw badRequest('invalid_invite', 'This invitation link is not valid or has expired.')
  }
  checkNewPassword(password, u.email)
  await db('users')
    .where({ id: u.id })
    .update({
      passwordHash: await bcrypt.hash(password, BCRYPT_COST),
      inviteTokenHash: null,
      lastSignInAt: new Date(),
    })
  return toSession(u)
}

/**
 * Role, crew or active flag. Run it in a transaction: demoting or deactivating an admin first locks
 * the active admins' rows, so two admins demoting each other at once cannot leave none.
 */
export async function updateUser(
  db: Db,
  actorId: number,
  id: number,
  patch: { role?: Role; active?: boolean; crewId?: number | null },
): Promise<UserRow> {
  if (id === actorId && (patch.active === false || (patch.role && patch.role !== 'admin'))) {
    throw badRequest('cannot_demote_self', 'You cannot deactivate yourself or remove your own admin role.')
  }
  const removesAdmin = patch.active === false || (patch.role !== undefined && patch.role !== 'admin')
  // Locked before the target row so every such change takes its locks in the same order.
  const admins: { id: number }[] = removesAdmin
    ? await db('users').where({ role: 'admin', active: true }).forUpdate().select('id')
    : []
  const target = await db('users').where({ id }).forUpdate().first('role', 'active')
  if (!target) throw notFound('User')
  if (removesAdmin && admins.some((a) => a.id === id) && admins.length <= 1) {
    throw conflict('last_admin', 'This is the last active admin. Make someone else an admin first.')
  }
  const revoke =
    (patch.role !== undefined && patch.role !== target.role) ||
    (patch.active === false && Boolean(target.active))
  await db('users')
    .where({ id })
    .update({ ...patch, ...(revoke ? { tokenVersion: db.raw('token_version + 1') } : {}) })
  return getUser(db, id)
}
