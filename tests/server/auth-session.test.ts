import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

// Issue 14: the client's start-up session check must not answer 401 (Chromium logs every 4xx fetch as
// a console error, which Lighthouse's best-practices audit counts). /auth/me keeps its 401 for API
// callers (tests/server/auth.test.ts).
describe('GET /auth/session', () => {
  it('answers 200 with user null without a session', async () => {
    const res = await request(t.app).get('/api/v1/auth/session')
    expect(res.status).toBe(200)
    expect(res.body).toEqual({ user: null })
  })

  it('answers 200 with user null for a forged or unknown token', async () => {
    const bearer = await request(t.app).get('/api/v1/auth/session').set('Authorization', 'Bearer not.a.token')
    expect(bearer.status).toBe(200)
    expect(bearer.body).toEqual({ user: null })
    const cookie = await request(t.app).get('/api/v1/auth/session').set('Cookie', 'lw_session=not.a.token')
    expect(cookie.status).toBe(200)
    expect(cookie.body).toEqual({ user: null })
  })

  it('answers the signed-in user by cookie, as /auth/me does', async () => {
    const signIn = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: 'crew@example.org', password: 'lampwright' })
    const cookie = signIn.headers['set-cookie']
    const session = await request(t.app).get('/api/v1/auth/session').set('Cookie', cookie)
    const me = await request(t.app).get('/api/v1/auth/me').set('Cookie', cookie)
    expect(session.status).toBe(200)
    // The demo crew account (seeds/demo/accounts.ts: crew@example.org, role crew).
    expect(session.body.user).toMatchObject({ email: 'crew@example.org', role: 'crew' })
    expect(session.body).toEqual(me.body)
  })

  it('is in the OpenAPI document as a public route', async () => {
    const doc = await request(t.app).get('/api/v1/openapi.json')
    expect(doc.body.paths['/api/v1/auth/session'].get['x-roles']).toEqual(['public'])
  })
})
