import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let crew: string
let stringId: number
beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
  // A lit 20-lamp filament catenary (19 shunted + fuse lamp) from the demo town.
  const s = await t
    .db('strings as s')
    .join('stringTypes as ty', 'ty.id', 's.typeId')
    .where({ 'ty.code': 'CAT-F20', 's.status': 'lit' })
    .first('s.id')
  stringId = s.id
})
afterAll(() => t.close())

const steps = (from: number, names: string[]) =>
  names.map((step, i) => ({ step, doneAt: new Date(from + i * 60_000).toISOString() }))
const before = ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester']
const after = ['remove_lock', 're_energise', 'functional_check', 'rcd_test']

describe('POST /visits', () => {
  it('logs a find-only visit, and the same Idempotency-Key returns the same visit, never a second', async () => {
    const key = randomUUID()
    const body = { stringId, failedFound: 2, replaced: 0, notes: 'Two out near the bakery end.' }
    const first = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', key)
      .send(body)
    expect(first.status).toBe(201)
    expect(first.body.string).toMatchObject({ id: stringId, lampsOut: 2 })
    // 2 shorted of 20 × 12 V on 230 V: 230 / (18 × 12) = 1.065 ≥ 1.05 (trade-reference §2–3) → replace now.
    expect(first.body.string.status).toBe('replace')
    expect(first.body.string.replaceNow).toBe(true)
    const again = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', key)
      .send(body)
    expect([200, 201]).toContain(again.status)
    expect(again.body.id).toBe(first.body.id)
    const n = await t.db('visits').where({ idempotencyKey: key }).count({ n: '*' })
    expect(Number(n[0].n)).toBe(1)
    const s = await t.db('strings').where({ id: stringId }).first('lampsOut')
    expect(s.lampsOut).toBe(2)
    const item = await t.db('queueItems').where({ stringId, kind: 'replace_now', state: 'open' }).first()
    expect(item).toBeDefined()
  })

  it('refuses a relamp without isolation unless the crew says why', async () => {
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId, failedFound: 0, replaced: 2 })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('isolation_required')
    expect((await t.db('strings').where({ id: stringId }).first('lampsOut')).lampsOut).toBe(2)
  })

  it('relamps under a recorded isolation and closes the queue item in the same commit', async () => {
    const isoKey = randomUUID()
    const t0 = Date.now() - 30 * 60_000
    const iso = await request(t.app)
      .post('/api/v1/isolations')
      .set('Authorization', crew)
      .set('Idempotency-Key', isoKey)
      .send({
        stringId,
        lockId: 'LK-117',
        testerId: 'VT-12',
        steps: [...steps(t0, before), ...steps(t0 + 20 * 60_000, after)],
      })
    expect(iso.status).toBe(201)
    expect(iso.body.state).toBe('restored')
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId, failedFound: 0, replaced: 2, isolationKey: isoKey })
    expect(res.status).toBe(201)
    expect(res.body.string).toMatchObject({ lampsOut: 0, status: 'lit', replaceNow: false })
    const open = await t
      .db('queueItems')
      .where({ stringId, kind: 'replace_now' })
      .whereIn('state', ['open', 'snoozed'])
      .first()
    expect(open).toBeUndefined()
  })

  it('rejects isolation steps stamped out of order', async () => {
    const t0 = Date.now()
    const bad = [...steps(t0, before)]
    bad[4] = { step: 'test_dead', doneAt: new Date(t0 - 3_600_000).toISOString() }
    const res = await request(t.app)
      .post('/api/v1/isolations')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId, steps: bad })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('steps_out_of_order')
  })

  it.each([
    ['replaced more than out + found', { failedFound: 1, replaced: 5 }, 'body.replaced'],
    ['a negative count', { failedFound: -1, replaced: 0 }, 'body.failedFound'],
    ['more lamps out than the string has', { failedFound: 25, replaced: 0 }, 'body.failedFound'],
  ])('answers %s with 400 validation_failed', async (_label, counts, field) => {
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId, ...counts, noIsolationReason: 'Isolated at the pillar by the council team.' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.fields[0].path).toBe(field)
  })

  it('needs an Idempotency-Key and a field role', async () => {
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .send({ stringId, failedFound: 0, replaced: 0 })
    expect(res.body.error.code).toBe('idempotency_key_required')
    const mgr = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', `Bearer ${await t.token('manager')}`)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId, failedFound: 0, replaced: 0 })
    expect(mgr.status).toBe(403)
  })
})

describe('GET /strings', () => {
  it('answers a bounding box with the strings inside it only', async () => {
    const res = await request(t.app)
      .get('/api/v1/strings?bbox=-2.305,54.034,-2.295,54.036')
      .set('Authorization', crew)
    expect(res.status).toBe(200)
    expect(res.body.items.length).toBeGreaterThan(0)
    for (const s of res.body.items) {
      expect(s.lng).toBeGreaterThanOrEqual(-2.305)
      expect(s.lng).toBeLessThanOrEqual(-2.295)
      expect(s.lat).toBeGreaterThanOrEqual(54.034)
      expect(s.lat).toBeLessThanOrEqual(54.036)
    }
    const bad = await request(t.app).get('/api/v1/strings?bbox=1,2,3').set('Authorization', crew)
    expect(bad.body.error.code).toBe('validation_failed')
  })

  it('includes the assessment and lead forecast in a string page, the whole forecast on its own route', async () => {
    const res = await request(t.app).get(`/api/v1/strings/${stringId}`).set('Authorization', crew)
    expect(res.status).toBe(200)
    expect(res.body.assessment.classes).toHaveLength(2)
    expect(res.body.outlook).toMatchObject({ source: expect.stringMatching(/^(queue|page)$/) })
    expect(res.body).not.toHaveProperty('forecast')
    const whole = await request(t.app).get(`/api/v1/strings/${stringId}/forecast`).set('Authorization', crew)
    expect(whole.status).toBe(200)
    expect(whole.body.forecast.meanHoursToFailure.length).toBeGreaterThan(0)
    const none = await request(t.app).get('/api/v1/strings/99999999/forecast').set('Authorization', crew)
    expect(none.status).toBe(404)
    expect(res.body.schedule.burnHoursPerDay).toBe(7) // 16:00–23:00 in the demo contract
  })
})
