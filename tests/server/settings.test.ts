import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let admin: string
beforeAll(async () => {
  t = await makeTestApp()
  admin = `Bearer ${await t.token('admin')}`
})
afterAll(() => t.close())

describe('replace-now threshold per string type', () => {
  it('restates the strings of a type at once when an admin lowers its threshold', async () => {
    const types = (await request(t.app).get('/api/v1/string-types').set('Authorization', admin)).body.items
    const cat = types.find((x: { code: string }) => x.code === 'CAT-F20')
    expect(cat.replaceAtRatio).toBe(1.05)
    // One lamp out of 20 × 12 V on 230 V: 230 / (19 × 12) = 1.009 (trade-reference §2) — Watch at 1.05.
    const s = await t
      .db('strings')
      .where({ typeId: cat.id, lampsOut: 1, fuseFailed: false, isolated: false, dark: false })
      .first('id')
    expect((await t.db('strings').where({ id: s.id }).first('status')).status).toBe('watch')
    const res = await request(t.app)
      .patch(`/api/v1/string-types/${cat.id}`)
      .set('Authorization', admin)
      .send({ replaceAtRatio: 1.005 })
    expect(res.status).toBe(200)
    expect(res.body.restated).toBeGreaterThan(0)
    expect((await t.db('strings').where({ id: s.id }).first('status')).status).toBe('replace')
    const back = await request(t.app)
      .patch(`/api/v1/string-types/${cat.id}`)
      .set('Authorization', admin)
      .send({ replaceAtRatio: 1.05 })
    expect(back.status).toBe(200)
    expect((await t.db('strings').where({ id: s.id }).first('status')).status).toBe('watch')
  })

  it('refuses a threshold below rating and non-admins', async () => {
    const bad = await request(t.app)
      .patch('/api/v1/string-types/1')
      .set('Authorization', admin)
      .send({ replaceAtRatio: 0.9 })
    expect(bad.body.error.code).toBe('validation_failed')
    const sup = await request(t.app)
      .patch('/api/v1/string-types/1')
      .set('Authorization', `Bearer ${await t.token('supervisor')}`)
      .send({ replaceAtRatio: 1.1 })
    expect(sup.status).toBe(403)
  })
})
