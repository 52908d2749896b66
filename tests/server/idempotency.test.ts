// Keyed writes are stored once, even when the phone's sends arrive at the same moment: the unique
// index on the Idempotency-Key decides, and every send is answered with the first result (never a 5xx).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { mkdtemp, readdir, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { makeTestApp, type TestApp } from './helpers'
import { jpeg } from '../fixtures/photos/build'
import { localFileStore } from '../../server/files/local-store'

let t: TestApp
let crew: string
let dir: string
beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
  dir = await mkdtemp(join(tmpdir(), 'lampwright-keyed-'))
  t.deps.files = localFileStore(dir)
})
afterAll(async () => {
  await rm(dir, { recursive: true, force: true })
  await t.close()
})

/** A lit string from the demo town that no other test of this file touches. */
async function litString(skip = 0): Promise<{ id: number; lampsOut: number }> {
  return t.db('strings').where({ status: 'lit' }).orderBy('id', 'desc').offset(skip).first('id', 'lampsOut')
}

const statuses = (rs: { status: number }[]) => rs.map((r) => r.status)
const all2xx = (rs: { status: number }[]) => rs.every((r) => r.status >= 200 && r.status < 300)

describe('ten simultaneous sends with one key', () => {
  it('store one isolation with its steps once; all ten answer 2xx with the same id', async () => {
    const s = await litString(0)
    const key = randomUUID()
    const t0 = Date.now() - 20 * 60_000
    const names = ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester']
    const body = {
      stringId: s.id,
      lockId: 'LK-201',
      steps: names.map((step, i) => ({ step, doneAt: new Date(t0 + i * 60_000).toISOString() })),
    }
    const send = () =>
      request(t.app)
        .post('/api/v1/isolations')
        .set('Authorization', crew)
        .set('Idempotency-Key', key)
        .send(body)
    const answers = await Promise.all(Array.from({ length: 10 }, send))
    expect(all2xx(answers), `statuses ${statuses(answers)}`).toBe(true)
    expect(statuses(answers).filter((c) => c === 201)).toHaveLength(1)
    expect(new Set(answers.map((r) => r.body.id)).size).toBe(1)
    for (const r of answers) expect(r.body.state).toBe('isolated')
    const rows = await t.db('isolations').where({ idempotencyKey: key }).select('id')
    expect(rows).toHaveLength(1)
    const steps = await t.db('isolationSteps').where({ isolationId: rows[0].id }).count({ n: '*' })
    expect(Number(steps[0].n)).toBe(names.length)
  })

  it('store one visit and change the string once', async () => {
    const s = await litString(1)
    const key = randomUUID()
    const body = { stringId: s.id, failedFound: 1, replaced: 0, notes: 'One out at the far end.' }
    const send = () =>
      request(t.app).post('/api/v1/visits').set('Authorization', crew).set('Idempotency-Key', key).send(body)
    const answers = await Promise.all(Array.from({ length: 10 }, send))
    expect(all2xx(answers), `statuses ${statuses(answers)}`).toBe(true)
    expect(statuses(answers).filter((c) => c === 201)).toHaveLength(1)
    expect(new Set(answers.map((r) => r.body.id)).size).toBe(1)
    const visits = await t.db('visits').where({ idempotencyKey: key }).count({ n: '*' })
    expect(Number(visits[0].n)).toBe(1)
    // One lamp found out, counted once: a second count would make it two.
    expect((await t.db('strings').where({ id: s.id }).first('lampsOut')).lampsOut).toBe(s.lampsOut + 1)
  })
})

describe('two simultaneous photo uploads with one key', () => {
  it('store one set of photos and files; both answers list the same photos', async () => {
    const author = await t.db('users').where({ email: 'crew@example.org' }).first('id')
    const visitId = (await t.db('visits').where({ userId: author.id }).first('id')).id
    const key = randomUUID()
    const [a, b] = [await jpeg(40, 30), await jpeg(30, 40)]
    const send = () =>
      request(t.app)
        .post(`/api/v1/visits/${visitId}/photos`)
        .set('Authorization', crew)
        .set('Idempotency-Key', key)
        .attach('photo', a, { filename: 'a.jpg', contentType: 'image/jpeg' })
        .attach('photo', b, { filename: 'b.jpg', contentType: 'image/jpeg' })
    const answers = await Promise.all([send(), send()])
    expect(all2xx(answers), `statuses ${statuses(answers)}`).toBe(true)
    const ids = answers.map((r) => r.body.items.map((i: { id: number }) => i.id))
    expect(ids[0]).toHaveLength(2)
    expect(ids[1]).toEqual(ids[0])
    const rows = await t.db('photos').where({ visitId, uploadKey: key }).select('id')
    expect(rows.map((r) => r.id).sort()).toEqual([...ids[0]].sort())
    // Two photos, each a full image and a thumbnail; the other send's files were removed.
    expect(await readdir(dir)).toHaveLength(4)
    await t.db('photos').whereIn('id', ids[0]).delete()
  })
})

describe('public reports with a key', () => {
  let proxied: TestApp
  beforeAll(async () => {
    // Its own documentation address (RFC 5737 TEST-NET-3), so the per-address report limit of other tests stays apart.
    proxied = await makeTestApp({ TRUST_PROXY: 'loopback' })
  })
  afterAll(() => proxied.close())
  const send = (key?: string) => {
    const req = request(proxied.app).post('/api/v1/reports').set('X-Forwarded-For', '203.0.113.160')
    return (key ? req.set('Idempotency-Key', key) : req).send({
      street: 'Market Street',
      description: 'Half the lights over the square are out.',
    })
  }

  it('store one report for three simultaneous sends, and a later repeat answers 200 with it', async () => {
    const key = randomUUID()
    const answers = await Promise.all([send(key), send(key), send(key)])
    expect(all2xx(answers), `statuses ${statuses(answers)}`).toBe(true)
    expect(new Set(answers.map((r) => r.body.ref)).size).toBe(1)
    const rows = await t.db('reports').where({ idempotencyKey: key }).select('id')
    expect(rows).toHaveLength(1)
    const items = await t.db('queueItems').where({ reportId: rows[0].id }).count({ n: '*' })
    expect(Number(items[0].n)).toBe(1)
    const later = await send(key)
    expect([later.status, later.body.ref]).toEqual([200, answers[0].body.ref])
  })

  it('still take a report without a key (the header is optional there)', async () => {
    const res = await send()
    expect(res.status).toBe(201)
    expect(res.body.ref).toMatch(/^LW-/)
  })
})

describe('the Idempotency-Key header', () => {
  it('is refused when malformed, and required on visits and isolations', async () => {
    for (const path of ['/api/v1/visits', '/api/v1/isolations']) {
      const missing = await request(t.app).post(path).set('Authorization', crew).send({})
      expect([missing.status, missing.body.error.code]).toEqual([400, 'idempotency_key_required'])
      const bad = await request(t.app)
        .post(path)
        .set('Authorization', crew)
        .set('Idempotency-Key', 'not a key!')
        .send({})
      expect([bad.status, bad.body.error.code]).toEqual([400, 'idempotency_key_invalid'])
    }
  })

  it('is listed in the OpenAPI document: required on visits and isolations, optional on photos and reports', async () => {
    const doc = (await request(t.app).get('/api/v1/openapi.json')).body
    type Param = { in: string; name: string; required?: boolean }
    const header = (path: string, method: string) =>
      ((doc.paths[path][method].parameters ?? []) as Param[]).find(
        (p) => p.in === 'header' && p.name === 'Idempotency-Key',
      )
    expect(header('/api/v1/visits', 'post')?.required).toBe(true)
    expect(header('/api/v1/isolations', 'post')?.required).toBe(true)
    expect(header('/api/v1/visits/{id}/photos', 'post')).toBeDefined()
    expect(header('/api/v1/visits/{id}/photos', 'post')?.required ?? false).toBe(false)
    expect(header('/api/v1/reports', 'post')?.required ?? false).toBe(false)
    expect(header('/api/v1/reports', 'post')).toBeDefined()
    expect(header('/api/v1/strings', 'get')).toBeUndefined()
  })
})
