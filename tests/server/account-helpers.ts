// Throw-away accounts for tests that sign out, change passwords or roles, or meet the sign-in limit:
// the demo accounts stay untouched for every other test file, and each test has its own e-mail.
import { randomUUID } from 'node:crypto'
import request from 'supertest'
import bcrypt from 'bcryptjs'
import type { Role } from '../../shared/roles'
import type { TestApp } from './helpers'

export const TEST_PASSWORD = 'a-long-test-password'

export interface Account {
  id: number
  email: string
  password: string
}

export const uniqueEmail = (label: string): string => `${label}.${randomUUID().slice(0, 8)}@example.org`

/** An active user with a password; a low bcrypt cost keeps the tests quick. */
export async function createAccount(t: TestApp, role: Role, password = TEST_PASSWORD): Promise<Account> {
  const email = uniqueEmail(role)
  const [id] = await t.db('users').insert({
    name: `Test ${role}`,
    email,
    role,
    active: true,
    passwordHash: await bcrypt.hash(password, 4),
  })
  return { id, email, password }
}

export function signIn(t: TestApp, email: string, password: string, headers: Record<string, string> = {}) {
  return request(t.app).post('/api/v1/auth/sign-in').set(headers).send({ email, password })
}

/** Signs in and returns the token; fails the test when sign-in does not succeed. */
export async function tokenFor(t: TestApp, a: Account): Promise<string> {
  const res = await signIn(t, a.email, a.password)
  if (res.status !== 200) throw new Error(`sign-in as ${a.email} failed: ${res.status}`)
  return res.body.token
}

/** Clears the loopback address's sign-in counter that a test pushed up (its own key only). */
export async function clearLoopbackSignInCount(t: TestApp): Promise<void> {
  await t.db('rateLimits').where('key', 'like', 'sign-in-address:%127.0.0.1').delete()
}
