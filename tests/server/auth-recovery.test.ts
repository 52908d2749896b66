// Access recovery: forgot password → one-time link by mail → new password, every old session ended;
// and an admin sending an invitation again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomInt } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { createAccount, signIn, tokenFor, uniqueEmail } from './account-helpers'

let t: TestApp
// Each test comes from its own address (TRUST_PROXY), so the per-address limit counts only its requests.
beforeAll(async () => {
  t = await makeTestApp({ TRUST_PROXY: 'loopback' })
})
afterAll(() => t.close())

const newAddress = () => `10.${randomInt(256)}.${randomInt(256)}.${randomInt(1, 255)}`
const forgot = (email: string, ip: string) =>
  request(t.app).post('/api/v1/auth/forgot-password').set('X-Forwarded-For', ip).send({ email })
const reset = (token: string, password: string) =>
  request(t.app).post('/api/v1/auth/reset-password').send({ token, password })
const me = (token: string) => request(t.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${token}`)

/** The caught mail to `to` whose text matches `link`; the first attempt is made after the answer. */
async function caughtLink(to: string, link: RegExp, skip = 0): Promise<string> {
  for (let i = 0; i < 100; i++) {
    const mails = await t.db('caughtMail').where({ toAddress: to }).orderBy('id').select('text')
    const m = mails[skip] && link.exec(mails[skip].text)
    if (m) return m[1]
    await new Promise((r) => setTimeout(r, 50))
  }
  throw new Error(`no mail to ${to}`)
}

describe('forgot and reset password', () => {
  it('mails a one-time link that sets the password and ends every old session', async () => {
    const a = await createAccount(t, 'supervisor')
    const old = await tokenFor(t, a)
    const ip = newAddress()
    const res = await forgot(a.email.toUpperCase(), ip)
    expect(res.status).toBe(202)
    const token = await caughtLink(a.email, /\/reset-password\?token=([\w-]+)/)

    const short = await reset(token, 'elevenchars') // 11 characters, one short of 12
    expect(short.status).toBe(400)
    expect(short.body.error.code).toBe('password_too_short')
    // 'password1234' is in NCSC's 100k most used passwords (server/services/common-passwords.txt).
    const common = await reset(token, 'Password1234')
    expect(common.status).toBe(400)
    expect(common.body.error.code).toBe('password_too_common')

    const done = await reset(token, 'a-brand-new-password-2026')
    expect(done.status).toBe(200)
    expect(done.body.user.email).toBe(a.email)
    expect((await me(old)).status).toBe(401) // the session from before the reset
    expect((await me(done.body.token)).status).toBe(200)
    expect((await signIn(t, a.email, a.password)).status).toBe(401)
    expect((await signIn(t, a.email, 'a-brand-new-password-2026')).status).toBe(200)

    const reused = await reset(token, 'another-new-password-2026')
    expect(reused.status).toBe(400)
    expect(reused.body.error.code).toBe('reset_token_invalid')
    expect(await t.db('auditLog').where({ action: 'password_reset', entityId: a.id })).toHaveLength(1)
    // Only a hash of the token is stored, and the sent mail no longer holds the link in the outbox.
    expect(await t.db('passwordResets').where({ userId: a.id }).first()).toMatchObject({
      tokenHash: expect.not.stringContaining(token),
    })
    const out = await t.db('emailOutbox').where({ toAddress: a.email, topic: 'password_reset' }).first()
    expect(out.state).toBe('sent')
    expect(out.text).not.toContain(token)
  })

  it('answers an unknown or deactivated address exactly like a known one, and mails nothing', async () => {
    const known = await createAccount(t, 'crew')
    const gone = await createAccount(t, 'crew')
    await t.db('users').where({ id: gone.id }).update({ active: false })
    const unknown = uniqueEmail('nobody')
    const answers = [
      await forgot(known.email, newAddress()),
      await forgot(unknown, newAddress()),
      await forgot(gone.email, newAddress()),
    ]
    for (const r of answers) expect(r.status).toBe(202)
    expect(answers[1].body).toEqual(answers[0].body)
    expect(answers[2].body).toEqual(answers[0].body)
    // The outbox row is written before the answer; none for the unknown or deactivated address.
    expect(await t.db('emailOutbox').where({ toAddress: known.email })).toHaveLength(1)
    expect(await t.db('emailOutbox').whereIn('toAddress', [unknown, gone.email])).toHaveLength(0)
    expect(await t.db('caughtMail').whereIn('toAddress', [unknown, gone.email])).toHaveLength(0)
  })

  it('refuses an expired link and an older link once a newer one is sent', async () => {
    const a = await createAccount(t, 'manager')
    const ip = newAddress()
    await forgot(a.email, ip)
    const first = await caughtLink(a.email, /token=([\w-]+)/)
    await forgot(a.email, ip)
    const second = await caughtLink(a.email, /token=([\w-]+)/, 1)
    expect((await reset(first, 'a-brand-new-password-2026')).body.error.code).toBe('reset_token_invalid')
    await t
      .db('passwordResets')
      .where({ userId: a.id })
      .update({ expiresAt: new Date(Date.now() - 1000) })
    expect((await reset(second, 'a-brand-new-password-2026')).body.error.code).toBe('reset_token_invalid')
  })

  it('limits requests: three mails an hour to one address, ten requests per 15 minutes from one network', async () => {
    const a = await createAccount(t, 'crew')
    for (let i = 0; i < 4; i++) expect((await forgot(a.email, newAddress())).status).toBe(202)
    // The fourth is answered the same way but sends nothing (3 per hour per e-mail).
    expect(await t.db('emailOutbox').where({ toAddress: a.email })).toHaveLength(3)
    const ip = newAddress()
    for (let i = 0; i < 10; i++) expect((await forgot(uniqueEmail('x'), ip)).status).toBe(202)
    const over = await forgot(uniqueEmail('x'), ip)
    expect(over.status).toBe(429)
    expect(over.body.error.code).toBe('rate_limited')
  })
})

describe('sending an invitation again', () => {
  it('mails a new link, ends the old one, and stops once the password is set', async () => {
    const admin = `Bearer ${await t.token('admin')}`
    const email = uniqueEmail('invitee')
    const made = await request(t.app)
      .post('/api/v1/users')
      .set('Authorization', admin)
      .send({ name: 'Ifan Rhys', email, role: 'crew' })
    expect(made.body.user.invitePending).toBe(true)
    const id = made.body.user.id
    const firstToken = await caughtLink(email, /token=([\w-]+)/)
    const crew = `Bearer ${await t.token('crew')}`
    expect((await request(t.app).post(`/api/v1/users/${id}/invite`).set('Authorization', crew)).status).toBe(
      403,
    )

    const again = await request(t.app).post(`/api/v1/users/${id}/invite`).set('Authorization', admin)
    expect(again.status).toBe(200)
    const secondToken = await caughtLink(email, /token=([\w-]+)/, 1)
    expect(secondToken).not.toBe(firstToken)
    const accept = (token: string) =>
      request(t.app).post('/api/v1/auth/accept-invite').send({ token, password: 'a-long-enough-password' })
    expect((await accept(firstToken)).body.error.code).toBe('invalid_invite')
    expect((await accept(secondToken)).status).toBe(200)

    const late = await request(t.app).post(`/api/v1/users/${id}/invite`).set('Authorization', admin)
    expect(late.status).toBe(409)
    expect(late.body.error.code).toBe('invite_not_pending')
    expect(await t.db('auditLog').where({ action: 'invite_resend', entityId: id })).toHaveLength(1)
  })
})
