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
