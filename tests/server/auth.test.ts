import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import bcrypt from 'bcryptjs'
import { makeTestApp, type TestApp } from './helpers'
import { clearLoopbackSignInCount, createAccount } from './account-helpers'
import { roleHome, roles } from '../../shared/roles'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

describe('sign-in and sessions', () => {
  it.each(roles)(
    'signs in the demo %s account and returns the user and a token in body and cookie',
    async (role) => {
      const res = await request(t.app)
        .post('/api/v1/auth/sign-in')
        .send({ email: `${role}@example.org`, password: 'lampwright' })
      expect(res.status).toBe(200)
      expect(res.body.user).toMatchObject({ email: `${role}@example.org`, role })
      expect(typeof res.body.token).toBe('string')
      const cookie = String(res.headers['set-cookie'])
      expect(cookie).toMatch(/lw_session=/)
      expect(cookie).toMatch(/HttpOnly/)
      expect(cookie).toMatch(/SameSite=Lax/)
      expect(roleHome[role]).toMatch(/^\//)
    },
  )

  it('accepts the cookie and the Bearer header alike', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'crew@example.org', password: 'lampwright' })
    const byCookie = await request(t.app).get('/api/v1/auth/me').set('Cookie', res.headers['set-cookie'])
    const byBearer = await request(t.app)
      .get('/api/v1/auth/me')
      .set('Authorization', `Bearer ${res.body.token}`)
    expect(byCookie.body.user.role).toBe('crew')
    expect(byBearer.body.user.role).toBe('crew')
  })

  it('answers wrong credentials with 401 invalid_credentials and no token with 401 unauthenticated', async () => {
    const bad = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'crew@example.org', password: 'wrong' })
    expect(bad.status).toBe(401)
    expect(bad.body.error.code).toBe('invalid_credentials')
    const none = await request(t.app).get('/api/v1/auth/me')
    expect(none.status).toBe(401)
    expect(none.body.error.code).toBe('unauthenticated')
    const forged = await request(t.app).get('/api/v1/auth/me').set('Authorization', 'Bearer not.a.token')
    expect(forged.status).toBe(401)
  })

  it('answers the wrong role with 403 forbidden', async () => {
    const res = await request(t.app)
      .get('/api/v1/users')
      .set('Authorization', `Bearer ${await t.token('crew')}`)
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('forbidden')
  })

  it('rate-limits repeated failed sign-ins with 429 rate_limited', async () => {
    // Its own account: the counters live in the database and outlast this test (sign-in-limit.test.ts).
    const { email, password } = await createAccount(t, 'safety')
    let last = 0
    for (let i = 0; i < 11; i++) {
      last = (
        await request(t.app)
          .post('/api/v1/auth/sign-in')
          .send({ email, password: `guess-${i}` })
      ).status
    }
    expect(last).toBe(429)
    const res = await request(t.app).post('/api/v1/auth/sign-in').send({ email, password })
    expect(res.body.error.code).toBe('rate_limited')
    await clearLoopbackSignInCount(t)
  })

  it('stores passwords with bcrypt at cost 10 or more (OWASP Password Storage Cheat Sheet)', async () => {
    const row = await t.db('users').where({ email: 'admin@example.org' }).first('passwordHash')
    expect(bcrypt.getRounds(row.passwordHash)).toBeGreaterThanOrEqual(10)
  })

  it('rejects an invalid body with 400 validation_failed and field details', async () => {
    const res = await request(t.app).post('/api/v1/auth/sign-in').send({ email: 'not-an-email' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.fields.map((f: { path: string }) => f.path)).toEqual(
      expect.arrayContaining(['body.email', 'body.password']),
    )
  })
})

describe('inviting users', () => {
  it('invites by e-mail through the mail fake, lets the invitee set a password, and sign in', async () => {
    const admin = `Bearer ${await t.token('admin')}`
    const email = `new.crew.${Date.now()}@example.org`
    const res = await request(t.app)
      .post('/api/v1/users')
      .set('Authorization', admin)
      .send({ name: 'Ffion Aldous', email, role: 'crew' })
    expect(res.status).toBe(201)
    let mail: { text: string } | undefined
    for (let i = 0; i < 50 && !mail; i++) {
      mail = await t.db('caughtMail').where('toAddress', email).first()
      if (!mail) await new Promise((r) => setTimeout(r, 50))
    }
    expect(mail).toBeDefined()
    const token = /token=([\w-]+)/.exec(mail!.text)![1]
    const accepted = await request(t.app)
      .post('/api/v1/auth/accept-invite')
      .send({ token, password: 'a-long-enough-password' })
    expect(accepted.status).toBe(200)
    expect(accepted.body.user.role).toBe('crew')
    const audited = await t.db('auditLog').where({ action: 'accept_invite', entityId: accepted.body.user.id })
    expect(audited).toHaveLength(1)
    const again = await request(t.app)
      .post('/api/v1/auth/accept-invite')
      .send({ token, password: 'a-long-enough-password' })
    expect(again.body.error.code).toBe('invalid_invite')
    const dup = await request(t.app)
      .post('/api/v1/users')
      .set('Authorization', admin)
      .send({ name: 'X', email, role: 'crew' })
    expect(dup.body.error.code).toBe('email_taken')
  })

  it('deactivates a user, whose token then stops working', async () => {
    const admin = `Bearer ${await t.token('admin')}`
    const email = `leaver.${Date.now()}@example.org`
    const created = await request(t.app)
      .post('/api/v1/users')
      .set('Authorization', admin)
      .send({ name: 'Leaver', email, role: 'manager' })
    const id = created.body.user.id
    const off = await request(t.app)
      .patch(`/api/v1/users/${id}`)
      .set('Authorization', admin)
      .send({ active: false })
    expect(off.body.user.active).toBe(false)
    const self = await t.db('users').where({ email: 'admin@example.org' }).first('id')
    const demote = await request(t.app)
      .patch(`/api/v1/users/${self.id}`)
      .set('Authorization', admin)
      .send({ role: 'crew' })
    expect(demote.body.error.code).toBe('cannot_demote_self')
  })
})
