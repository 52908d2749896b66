import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'

// Bright lamps on a visit (coils stuck together after a knock, trade-reference §2a): stored on the
// visit, answered back, shown in the string's history, and bounded by the lamps the string holds.
let t: TestApp
let crew: string
let stringId: number
beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
  // A demo catenary: 19 shunted lamps + 1 fuse lamp = 20 lamps in one chain (shared/lamp-catalogue.ts).
  const s = await t
    .db('strings as s')
    .join('stringTypes as ty', 'ty.id', 's.typeId')
    .where({ 'ty.code': 'CAT-F20' })
    .orderBy('s.id', 'desc')
    .first('s.id')
  stringId = s.id
})
afterAll(() => t.close())

const send = (body: Record<string, unknown>, key = randomUUID()) =>
  request(t.app)
    .post('/api/v1/visits')
    .set('Authorization', crew)
    .set('Idempotency-Key', key)
    .send({ stringId, failedFound: 0, replaced: 0, ...body })

describe('bright lamps on a visit', () => {
  it('stores the count, answers it, repeats it on a replay and shows it in the history', async () => {
    const key = randomUUID()
    const res = await send({ brightLamps: 2 }, key)
    expect(res.status).toBe(201)
    expect(res.body.brightLamps).toBe(2)
    const row = await t.db('visits').where({ idempotencyKey: key }).first('brightLamps')
    expect(row.brightLamps).toBe(2)
    const again = await send({ brightLamps: 2 }, key)
    expect(again.body).toMatchObject({ id: res.body.id, brightLamps: 2 })
    const page = await request(t.app).get(`/api/v1/strings/${stringId}`).set('Authorization', crew)
    const v = page.body.visits.find((x: { id: number }) => x.id === res.body.id)
    expect(v.brightLamps).toBe(2)
  })

  it('counts none when the body leaves it out', async () => {
    const key = randomUUID()
    const res = await send({}, key)
    expect(res.status).toBe(201)
    expect(res.body.brightLamps).toBe(0)
    expect((await t.db('visits').where({ idempotencyKey: key }).first('brightLamps')).brightLamps).toBe(0)
  })

  it.each([
    ['a negative count', -1],
    ['more than the 20 lamps in the string', 21],
    ['a fraction', 1.5],
  ])('answers %s with 400 validation_failed on body.brightLamps', async (_label, n) => {
    const res = await send({ brightLamps: n })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.fields[0].path).toBe('body.brightLamps')
  })

  it('accepts every lamp of the string being bright (20 of 20)', async () => {
    const res = await send({ brightLamps: 20 })
    expect(res.status).toBe(201)
  })
})
