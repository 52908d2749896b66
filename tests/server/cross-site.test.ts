import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { createAccount, signIn, tokenFor, type Account } from './account-helpers'
import { jpeg } from '../fixtures/photos/build'

let t: TestApp
let crew: Account
let cookie: string[]
let visitId: number
beforeAll(async () => {
  t = await makeTestApp()
  crew = await createAccount(t, 'crew')
  cookie = (await signIn(t, crew.email, crew.password)).headers['set-cookie'] as unknown as string[]
  visitId = (await t.db('visits').first('id')).id
})
afterAll(() => t.close())

const EVIL = 'https://evil.example'
const freshCookie = async () => {
  const a = await createAccount(t, 'crew')
  return (await signIn(t, a.email, a.password)).headers['set-cookie'] as unknown as string[]
}
const me = () => request(t.app).get('/api/v1/auth/me').set('Cookie', cookie)

function expectRefused(res: request.Response) {
  expect(res.status).toBe(403)
  expect(res.body.error.code).toBe('cross_site_request')
}

describe('writes authenticated by the session cookie alone', () => {
  it('refuses a JSON write from another site, and nothing changes', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/password')
      .set('Cookie', cookie)
      .set('Origin', EVIL)
      .send({ currentPassword: crew.password, newPassword: 'chosen-by-the-attacker' })
    expectRefused(res)
    expect((await signIn(t, crew.email, crew.password)).status).toBe(200)
  })

  it('refuses a multipart upload from another site before reading it', async () => {
    const res = await request(t.app)
      .post(`/api/v1/visits/${visitId}/photos`)
      .set('Cookie', cookie)
      .set('Origin', EVIL)
      .set('Idempotency-Key', randomUUID())
      .attach('photo', await jpeg(), { filename: 'a.jpg', contentType: 'image/jpeg' })
    expectRefused(res)
  })

  it('refuses a bodyless POST (sign-out) from another site: the session lives on', async () => {
    const res = await request(t.app).post('/api/v1/auth/sign-out').set('Cookie', cookie).set('Origin', EVIL)
    expectRefused(res)
    expect((await me()).status).toBe(200)
  })

  it('refuses a write that states no origin at all, and one marked cross-site', async () => {
    expectRefused(await request(t.app).post('/api/v1/auth/sign-out').set('Cookie', cookie))
    expectRefused(
      await request(t.app)
        .post('/api/v1/auth/sign-out')
        .set('Cookie', cookie)
        .set('Sec-Fetch-Site', 'cross-site'),
    )
    expectRefused(
      await request(t.app).post('/api/v1/auth/sign-out').set('Cookie', cookie).set('Origin', 'null'),
    )
    expect((await me()).status).toBe(200)
  })

  it("accepts the app's own origin and Sec-Fetch-Site: same-origin", async () => {
    const own = await request(t.app)
      .post('/api/v1/auth/sign-out')
      .set('Cookie', await freshCookie())
      .set('Host', 'lights.test:8080')
      .set('Origin', 'http://lights.test:8080')
    expect(own.status).toBe(204)
    const fetchSite = await request(t.app)
      .post('/api/v1/auth/sign-out')
      .set('Cookie', await freshCookie())
      .set('Sec-Fetch-Site', 'same-origin')
    expect(fetchSite.status).toBe(204)
    const otherPort = await request(t.app)
      .post('/api/v1/auth/sign-out')
      .set('Cookie', cookie)
      .set('Host', 'lights.test:8080')
      .set('Origin', 'http://lights.test:9090')
    expectRefused(otherPort)
  })

  it("with PUBLIC_URL set, only PUBLIC_URL's origin counts as the app's own", async () => {
    const pub = await makeTestApp({ PUBLIC_URL: 'https://lights.example.org/app/' })
    try {
      const ok = await request(pub.app)
        .post('/api/v1/auth/sign-out')
        .set('Cookie', await freshCookie())
        .set('Origin', 'https://lights.example.org')
      expect(ok.status).toBe(204)
      const byHost = await request(pub.app)
        .post('/api/v1/auth/sign-out')
        .set('Cookie', cookie)
        .set('Host', 'lights.test')
        .set('Origin', 'http://lights.test')
      expectRefused(byHost)
    } finally {
      await pub.close()
    }
  })
})

describe('writes that carry no session cookie', () => {
  it('leaves Bearer-token writes alone, whatever the Origin', async () => {
    const other = await createAccount(t, 'crew')
    const token = await tokenFor(t, other)
    const res = await request(t.app)
      .post('/api/v1/auth/sign-out')
      .set('Authorization', `Bearer ${token}`)
      .set('Cookie', cookie)
      .set('Origin', EVIL)
    expect(res.status).toBe(204)
    expect((await me()).status).toBe(200)
  })

  it('lets scripts sign in with no Origin, but not another site in a browser (login forgery)', async () => {
    const other = await createAccount(t, 'crew')
    expect((await signIn(t, other.email, other.password)).status).toBe(200)
    expectRefused(await signIn(t, other.email, other.password, { Origin: EVIL }))
    expectRefused(await signIn(t, other.email, other.password, { 'Sec-Fetch-Site': 'cross-site' }))
  })
})
