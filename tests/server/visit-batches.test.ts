// Visits sent at the same moment share a transaction (server/services/group-commit.ts): each send
// must still get its own answer, a refused send must not take the others down, two sends on one
// string must both count, and a key sent twice must still be stored once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { litCatenaries, makeTestApp, type TestApp } from './helpers'

let t: TestApp
let crew: string
beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
})
afterAll(() => t.close())

const send = (body: object, key = randomUUID()) =>
  request(t.app).post('/api/v1/visits').set('Authorization', crew).set('Idempotency-Key', key).send(body)

/** Lit CAT-F20 catenaries with no lamp out (helpers.ts). */
const catenaries = (n: number, skip = 0) => litCatenaries(t.db, n, { skip, noneOut: true })

describe('visits sent at the same moment', () => {
  it('answer each send on its own, share transactions, and a refused send leaves the others stored', async () => {
    const ids = await catenaries(8)
    let begins = 0
    const count = (q: { sql: string }) => {
      if (/^begin/i.test(q.sql)) begins++
    }
    t.db.on('query', count)
    const answers = await Promise.all([
      ...ids.map((stringId) => send({ stringId, failedFound: 1, replaced: 0, notes: 'One out.' })),
      // 30 lamps found failed on a 20-lamp string: refused (validation_failed), alone.
      send({ stringId: ids[0], failedFound: 30, replaced: 0 }),
    ])
    t.db.off('query', count)
    expect(answers.slice(0, 8).map((a) => a.status)).toEqual(Array(8).fill(201))
    expect(answers[8].status).toBe(400)
    expect(answers[8].body.error.code).toBe('validation_failed')
    // Each answer speaks of its own string and visit.
    expect(answers.slice(0, 8).map((a) => a.body.string.id)).toEqual(ids)
    expect(new Set(answers.slice(0, 8).map((a) => a.body.id)).size).toBe(8)
    const rows = await t.db('strings').whereIn('id', ids).select('lampsOut')
    expect(rows.map((r) => r.lampsOut)).toEqual(Array(8).fill(1))
    // Nine sends, fewer transactions (group commit; common practice, no source).
    expect(begins).toBeGreaterThan(0)
    expect(begins).toBeLessThan(9)
  })

  it('count two sends on one string one after the other', async () => {
    const [stringId] = await catenaries(1, 8)
    const answers = await Promise.all([
      send({ stringId, failedFound: 1, replaced: 0 }),
      send({ stringId, failedFound: 1, replaced: 0 }),
    ])
    expect(answers.map((a) => a.status)).toEqual([201, 201])
    const visits = await t
      .db('visits')
      .where({ stringId })
      .orderBy('id')
      .select('lampsOutBefore', 'lampsOutAfter')
    expect(visits.slice(-2)).toEqual([
      { lampsOutBefore: 0, lampsOutAfter: 1 },
      { lampsOutBefore: 1, lampsOutAfter: 2 },
    ])
    // 2 shorted of 20 × 12 V on 230 V: 230 / (18 × 12) = 1.065 ≥ 1.05 (trade-reference §2–3) → replace now.
    const s = await t.db('strings').where({ id: stringId }).first('lampsOut', 'status')
    expect(s).toEqual({ lampsOut: 2, status: 'replace' })
  })

  it('store a key sent twice at once only once, and answer both with that visit', async () => {
    const [stringId] = await catenaries(1, 9)
    const key = randomUUID()
    const body = { stringId, failedFound: 1, replaced: 0 }
    const answers = await Promise.all([send(body, key), send(body, key)])
    expect(answers.map((a) => a.status).sort()).toEqual([200, 201])
    expect(answers[0].body.id).toBe(answers[1].body.id)
    const n = await t.db('visits').where({ idempotencyKey: key }).count({ n: '*' })
    expect(Number(n[0].n)).toBe(1)
    const s = await t.db('strings').where({ id: stringId }).first('lampsOut')
    expect(s.lampsOut).toBe(1)
  })
})
