import { createHash, randomBytes } from 'node:crypto'
import bcrypt from 'bcryptjs'
import type { Db } from '../db'
import type { Role } from '../../shared/roles'
import { badRequest, conflict, notFound } from '../errors'

// OWASP password storage guidance: bcrypt work factor of at least 10.
export const BCRYPT_COST = 11
const INVITE_DAYS = 7
let dummyHash: string | undefined

const userColumns = ['id', 'name', 'email', 'role', 'crewId', 'active', 'invitedAt', 'lastSignInAt'] as const

export interface UserRow {
  id: number
  name: string
  email: string
  role: Role
  crewId: number | null
  active: boolean
  invitedAt: string | null
  lastSignInAt: string | null
}

const iso = (d: unknown): string | null => (d instanceof Date ? d.toISOString() : (d as string | null))

function mapUser(r: Record<string, unknown>): UserRow {
  return {
    ...(r as unknown as UserRow),
    active: Boolean(r.active),
    invitedAt: iso(r.invitedAt),
    lastSignInAt: iso(r.lastSignInAt),
  }
}

export const hashToken = (t: string): string => createHash('sha256').update(t).digest('hex')

export async function findActiveUser(db: Db, id: number) {
  const u = await db('users').where({ id, active: true }).first('id', 'name', 'email', 'role', 'crewId')
  return u ? { ...u, crewId: u.crewId ?? null } : null
}

export async function verifyCredentials(db: Db, email: string, password: string) {
  const u = await db('users').where({ email }).first()
  // Compare against a fixed hash when the user is unknown so timing does not reveal accounts.
  dummyHash ??= await bcrypt.hash('no account has this password', BCRYPT_COST)
  const hash = u?.passwordHash ?? dummyHash
  const ok = await bcrypt.compare(password, hash)
  if (!u || !ok || !u.active || !u.passwordHash) return null
  await db('users').where({ id: u.id }).update({ lastSignInAt: new Date() })
  return { id: u.id, name: u.name, email: u.email, role: u.role as Role, crewId: u.crewId ?? null }
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

export async function inviteUser(
  db: Db,
  input: { name: string; email: string; role: Role; crewId?: number | null },
) {
  const exists = await db('users').where({ email: input.email }).first('id')
  if (exists) throw conflict('email_taken', 'A user with this e-mail already exists.')
  const token = randomBytes(24).toString('base64url')
  const now = new Date()
  const [id] = await db('users').insert({
    name: input.name,
    email: input.email,
    role: input.role,
    crewId: input.crewId ?? null,
    active: true,
    inviteTokenHash: hashToken(token),
    invitedAt: now,
    inviteExpiresAt: new Date(now.getTime() + INVITE_DAYS * 86_400_000),
  })
  return { user: await getUser(db, id), token }
}

export async function acceptInvite(db: Db, token: string, password: string) {
  const u = await db('users')
    .where({ inviteTokenHash: hashToken(token), active: true })
    .first()
  if (!u || new Date(u.inviteExpiresAt) < new Date()) {
    throw badRequest('invalid_invite', 'This invitation link is not valid or has expired.')
  }
  await db('users')
    .where({ id: u.id })
    .update({
      passwordHash: await bcrypt.hash(password, BCRYPT_COST),
      inviteTokenHash: null,
      lastSignInAt: new Date(),
    })
  return { id: u.id, name: u.name, email: u.email, role: u.role as Role, crewId: u.crewId ?? null }
}

export async function updateUser(
  db: Db,
  actorId: number,
  id: number,
  patch: { role?: Role; active?: boolean; crewId?: number | null },
): Promise<UserRow> {
  await getUser(db, id)
  if (id === actorId && (patch.active === false || (patch.role && patch.role !== 'admin'))) {
    throw badRequest('cannot_demote_self', 'You cannot deactivate yourself or remove your own admin role.')
  }
  await db('users').where({ id }).update(patch)
  return getUser(db, id)
}
