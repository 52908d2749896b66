import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let safety: string
beforeAll(async () => {
  t = await makeTestApp()
  safety = `Bearer ${await t.token('safety')}`
})
afterAll(() => t.close())

describe('isolation sign-off', () => {
  it('lists isolations with findings and records an approval', async () => {
    const crew = `Bearer ${await t.token('crew')}`
    const s = await t.db('strings').where({ status: 'lit' }).first('id')
    const t0 = Date.now() - 3_600_000
    // No lock identifier and no tester identifier: a lock-off needs a unique key (HSE HSG85).
    const steps = ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester'].map(
      (step, i) => ({ step, doneAt: new Date(t0 + i * 60_000).toISOString() }),
    )
    const made = await request(t.app)
      .post('/api/v1/isolations')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId: s.id, steps })
    expect(made.status).toBe(201)
    const list = await request(t.app)
      .get('/api/v1/isolations?review=pending&sort=newest&pageSize=100')
      .set('Authorization', safety)
    expect(list.status).toBe(200)
    const mine = list.body.items.find((i: { id: number }) => i.id === made.body.id)
    expect(mine.findings.map((f: { code: string }) => f.code)).toContain('no_lock_id')
    const ok = await request(t.app)
      .post(`/api/v1/isolations/${made.body.id}/review`)
      .set('Authorization', safety)
      .send({ decision: 'rejected', note: 'No lock recorded; brief the crew.' })
    expect(ok.status).toBe(204)
    const row = await t.db('isolations').where({ id: made.body.id }).first('review')
    expect(row.review).toBe('rejected')
    const crewTry = await request(t.app)
      .post(`/api/v1/isolations/${made.body.id}/review`)
      .set('Authorization', crew)
      .send({ decision: 'approved' })
    expect(crewTry.status).toBe(403)
  })
})

describe('certificates', () => {
  it('records an RCD test whose 5× trip time decides a fail (BS EN 61008-1: ≤ 40 ms), and the queue shows it', async () => {
    const circuit = await t.db('circuits').orderBy('id', 'desc').first('id')
    const res = await request(t.app)
      .post('/api/v1/certificates')
      .set('Authorization', safety)
      .send({
        kind: 'rcd_test',
        subjectType: 'circuit',
        subjectId: circuit.id,
        doneOn: new Date().toISOString().slice(0, 10),
        readings: { ratedMa: 30, tripMsAt1x: 28, tripMsAt5x: 47 },
      })
    expect(res.status).toBe(201)
    expect(res.body.result).toBe('fail')
    const item = await t
      .db('queueItems')
      .where({ kind: 'rcd_failed', state: 'open', openKey: `rcd_failed:circuit-rcd:${circuit.id}` })
      .first()
    expect(item).toBeDefined()
    const pass = await request(t.app)
      .post('/api/v1/certificates')
      .set('Authorization', safety)
      .send({
        kind: 'rcd_test',
        subjectType: 'circuit',
        subjectId: circuit.id,
        doneOn: new Date().toISOString().slice(0, 10),
        readings: { ratedMa: 30, tripMsAt1x: 22, tripMsAt5x: 14 },
      })
    expect(pass.body.result).toBe('pass')
    const closed = await t.db('queueItems').where({ id: item.id }).first('state')
    expect(closed.state).toBe('closed')
    const list = await request(t.app).get('/api/v1/certificates?kind=rcd_test').set('Authorization', safety)
    expect(list.body.items.find((c: { subjectId: number }) => c.subjectId === circuit.id).result).toBe('pass')
  })

  it('refuses an unknown subject with a code', async () => {
    const res = await request(t.app).post('/api/v1/certificates').set('Authorization', safety).send({
      kind: 'anchor_test',
      subjectType: 'structure',
      subjectId: 999999,
      doneOn: '2026-11-30',
      result: 'pass',
    })
    expect(res.body.error.code).toBe('unknown_subject')
  })
})

describe('overdue report', () => {
  it('groups open work by client with its contract response targets', async () => {
    const res = await request(t.app)
      .get('/api/v1/overdue')
      .set('Authorization', `Bearer ${await t.token('manager')}`)
    expect(res.status).toBe(200)
    const town = res.body.clients.find((c: { name: string }) => c.name === 'Wrenfold Town Council')
    expect(town).toMatchObject({ emergencyHours: 24, standardHours: 36 })
    for (const i of town.items) expect(i.overdue || i.hoursLeft <= res.body.dueSoonHours).toBe(true)
  })
})
