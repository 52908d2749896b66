import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

describe('public fault reports', () => {
  it('takes a report without an account, gives a reference, and puts it in the queue', async () => {
    const res = await request(t.app)
      .post('/api/v1/reports')
      .send({ tag: 'wf-hs-014', description: 'Lights flickering and buzzing.', hazard: true })
    expect(res.status).toBe(201)
    expect(res.body.ref).toMatch(/^LW-[0-9A-HJKMNP-TV-Z]{5}$/)
    expect(res.body.state).toBe('received')
    const status = await request(t.app).get(`/api/v1/reports/${res.body.ref.toLowerCase()}`)
    expect(status.body.ref).toBe(res.body.ref)
    const report = await t.db('reports').where({ ref: res.body.ref }).first('id', 'stringId', 'sourceHash')
    expect(report.stringId).not.toBeNull()
    expect(report.sourceHash).toMatch(/^[0-9a-f]{64}$/)
    const item = await t.db('queueItems').where({ reportId: report.id, state: 'open' }).first('severity')
    expect(item.severity).toBe('emergency')
  })

  it('asks for a tag, a street or a location', async () => {
    const res = await request(t.app).post('/api/v1/reports').send({ description: 'Some lights are out.' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    const bad = await request(t.app).get('/api/v1/reports/nonsense')
    expect(bad.body.error.code).toBe('validation_failed')
  })
})

describe('limits per address on the public pages', () => {
  // An app behind a trusted loopback proxy, so each test has its own documentation address
  // (RFC 5737 TEST-NET-3) and the counters of other tests, kept in the database, stay apart.
  let proxied: TestApp
  beforeAll(async () => {
    proxied = await makeTestApp({ TRUST_PROXY: 'loopback' })
  })
  afterAll(() => proxied.close())
  const from = (host: number) => ({ 'X-Forwarded-For': `203.0.113.${host}` })

  it('answers the status look-up 60 times per address in 15 minutes, then 429 with Retry-After', async () => {
    const ref = (await t.db('reports').first('ref')).ref as string
    for (let i = 0; i < 60; i++) {
      const res = await request(proxied.app).get(`/api/v1/reports/${ref}`).set(from(101))
      expect(res.status).toBe(200)
    }
    const limited = await request(proxied.app).get(`/api/v1/reports/${ref}`).set(from(101))
    expect(limited.status).toBe(429)
    expect(limited.body.error.code).toBe('rate_limited')
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0)
    expect((await request(proxied.app).get(`/api/v1/reports/${ref}`).set(from(102))).status).toBe(200)
  })

  it('takes 10 report requests per address in an hour, counted across app processes', async () => {
    const second = await makeTestApp({ TRUST_PROXY: 'loopback' })
    try {
      // Incomplete reports are counted too (the limit runs first), and leave no rows in the queue.
      const send = (app: TestApp) =>
        request(app.app).post('/api/v1/reports').set(from(103)).send({ description: 'Lamps out.' })
      for (let i = 0; i < 10; i++) expect((await send(i % 2 ? proxied : second)).status).toBe(400)
      const limited = await send(second)
      expect(limited.status).toBe(429)
      expect(limited.body.error.code).toBe('rate_limited')
      expect(Number(limited.headers['retry-after'])).toBeGreaterThan(3000)
    } finally {
      await second.close()
    }
  })
})
