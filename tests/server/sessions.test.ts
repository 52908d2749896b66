import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import jwt from 'jsonwebtoken'
import { makeTestApp, type TestApp } from './helpers'
import { createAccount, signIn, tokenFor } from './account-helpers'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

const me = (token: string) => request(t.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${token}`)

describe('revoking sessions', () => {
  it('signing out ends the token on the server, on every device', async () => {
    const a = await createAccount(t, 'crew')
    const phone = await tokenFor(t, a)
    const laptop = await tokenFor(t, a)
    expect((await me(phone)).status).toBe(200)
    const out = await request(t.app).post('/api/v1/auth/sign-out').set('Authorization', `Bearer ${phone}`)
    expect(out.status).toBe(204)
    for (const token of [phone, laptop]) {
      const res = await me(token)
      expect(res.status).toBe(401)
      expect(res.body.error.code).toBe('unauthenticated')
    }
    expect((await me(await tokenFor(t, a))).status).toBe(200)
  })

  it('signing out by cookie clears the cookie and revokes it', async () => {
    const a = await createAccount(t, 'supervisor')
    const cookie = (await signIn(t, a.email, a.password)).headers['set-cookie']
    const out = await request(t.app)
      .post('/api/v1/auth/sign-out')
      .set('Cookie', cookie)
      .set('Sec-Fetch-Site', 'same-origin')
    expect(out.status).toBe(204)
    expect(String(out.headers['set-cookie'])).toMatch(/lw_session=;/)
    expect((await request(t.app).get('/api/v1/auth/me').set('Cookie', cookie)).status).toBe(401)
  })

  it('changing the password ends old tokens and gives this device a fresh session', async () => {
    const a = await createAccount(t, 'manager')
    const old = await tokenFor(t, a)
    const other = await tokenFor(t, a)
    const wrong = await request(t.app)
      .post('/api/v1/auth/password')
      .set('Authorization', `Bearer ${old}`)
      .send({ currentPassword: 'not-the-password', newPassword: 'a-new-password-2026' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.error.code).toBe('wrong_password')
    const short = await request(t.app)
      .post('/api/v1/auth/password')
      .set('Authorization', `Bearer ${old}`)
      .send({ currentPassword: a.password, newPassword: 'elevenchars' })
    expect(short.status).toBe(400)
    expect(short.body.error.code).toBe('validation_failed')
    const res = await request(t.app)
      .post('/api/v1/auth/password')
      .set('Authorization', `Bearer ${old}`)
      .send({ currentPassword: a.password, newPassword: 'a-new-password-2026' })
    expect(res.status).toBe(200)
    expect(String(res.headers['set-cookie'])).toMatch(/lw_session=[^;]+; /)
    expect(res.body.user).toEqual({
      id: a.id,
      name: 'Test manager',
      email: a.email,
      role: 'manager',
      crewId: null,
    })
    expect((await me(old)).status).toBe(401)
    expect((await me(other)).status).toBe(401)
    expect((await me(res.body.token)).status).toBe(200)
    expect((await signIn(t, a.email, a.password)).status).toBe(401)
    expect((await signIn(t, a.email, 'a-new-password-2026')).status).toBe(200)
    const row = await t.db('auditLog').where({ action: 'password_change', entityId: a.id }).first('userId')
    expect(row.userId).toBe(a.id)
  })

  it("a role change and a deactivation end the user's tokens", async () => {
    const admin = `Bearer ${await t.token('admin')}`
    const a = await createAccount(t, 'crew')
    const before = await tokenFor(t, a)
    const promoted = await request(t.app)
      .patch(`/api/v1/users/${a.id}`)
      .set('Authorization', admin)
      .send({ role: 'supervisor' })
    expect(promoted.status).toBe(200)
    expect((await me(before)).status).toBe(401)
    const after = await tokenFor(t, a)
    expect((await me(after)).body.user.role).toBe('supervisor')
    // A change that keeps role and access (crew only) leaves sessions alone.
    const crew = await t.db('crews').first('id')
    await request(t.app).patch(`/api/v1/users/${a.id}`).set('Authorization', admin).send({ crewId: crew.id })
    expect((await me(after)).status).toBe(200)
    await request(t.app).patch(`/api/v1/users/${a.id}`).set('Authorization', admin).send({ active: false })
    await request(t.app).patch(`/api/v1/users/${a.id}`).set('Authorization', admin).send({ active: true })
    expect((await me(after)).status).toBe(401)
  })

  it('refuses a token signed before the token version existed', async () => {
    const a = await createAccount(t, 'crew')
    const legacy = jwt.sign({ role: 'crew' }, t.deps.jwtSecret, { subject: String(a.id), expiresIn: '1h' })
    expect((await me(legacy)).status).toBe(401)
  })
})

describe('session cookie', () => {
  it('is HttpOnly and SameSite=Lax, and not Secure over plain http', async () => {
    const a = await createAccount(t, 'crew')
    const cookie = String((await signIn(t, a.email, a.password)).headers['set-cookie'])
    expect(cookie).toMatch(/HttpOnly/)
    expect(cookie).toMatch(/SameSite=Lax/)
    expect(cookie).not.toMatch(/Secure/)
  })

  it('ignores X-Forwarded-Proto unless TRUST_PROXY trusts the proxy, then is Secure', async () => {
    const a = await createAccount(t, 'crew')
    const https = { 'X-Forwarded-Proto': 'https' }
    const untrusted = String((await signIn(t, a.email, a.password, https)).headers['set-cookie'])
    expect(untrusted).not.toMatch(/Secure/)
    const proxied = await makeTestApp({ TRUST_PROXY: 'loopback' })
    try {
      const trusted = String((await signIn(proxied, a.email, a.password, https)).headers['set-cookie'])
      expect(trusted).toMatch(/; Secure/)
      expect(trusted).toMatch(/HttpOnly/)
    } finally {
      await proxied.close()
    }
  })
})
