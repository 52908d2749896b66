import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { refreshQueue } from '../../server/jobs/refresh-queue'

// Reports come from a documentation address of their own (RFC 5737 TEST-NET-2) through a trusted
// loopback proxy, so the public form's per-address limit counts them apart from other tests.
let t: TestApp
let sup: string
let crew: string
beforeAll(async () => {
  t = await makeTestApp({ TRUST_PROXY: 'loopback' })
  sup = `Bearer ${await t.token('supervisor')}`
  crew = `Bearer ${await t.token('crew')}`
})
afterAll(() => t.close())

async function report(body: Record<string, unknown>) {
  const res = await request(t.app).post('/api/v1/reports').set('X-Forwarded-For', '198.51.100.7').send(body)
  expect(res.status).toBe(201)
  const row = await t.db('reports').where({ ref: res.body.ref }).first('id')
  return { ref: res.body.ref as string, id: row.id as number }
}

const itemsOf = (reportId: number) => t.db('queueItems').where({ reportId }).orderBy('id').select()
const publicStatus = async (ref: string) => (await request(t.app).get(`/api/v1/reports/${ref}`)).body

/** The job twice, as two 10-minute ticks would run it. */
async function twoRefreshes() {
  await refreshQueue(t.db)
  await refreshQueue(t.db)
}

describe('closing a public-report item', () => {
  it('stays closed through two refreshes, keeps its reason in its own column, and the reporter sees Fixed', async () => {
    const r = await report({ street: 'High Street', description: 'Three lamps out by the chemist.' })
    const [item] = await itemsOf(r.id)
    expect(item.state).toBe('open')
    const reason = 'Same fault as the catenary already on tonight’s run'
    const res = await request(t.app)
      .post(`/api/v1/queue/${item.id}/close`)
      .set('Authorization', sup)
      .send({ reason })
    expect(res.status).toBe(204)
    await twoRefreshes()
    const items = await itemsOf(r.id)
    expect(items).toHaveLength(1)
    expect(items[0]).toMatchObject({ id: item.id, state: 'closed', closeReason: reason, snoozeReason: null })
    expect(await publicStatus(r.ref)).toMatchObject({ state: 'fixed', stateLabel: 'Fixed' })
    const closed = await request(t.app)
      .get('/api/v1/queue?state=closed&kind=public_report')
      .set('Authorization', sup)
    expect(closed.body.items.find((i: { id: number }) => i.id === item.id)).toMatchObject({
      closeReason: reason,
      snoozeReason: null,
    })
  })

  it('tells the reporter "not ours" when the supervisor says so, and refuses that choice on other kinds', async () => {
    const r = await report({ street: 'Quay Parade', description: 'Lights on the harbour wall are out.' })
    const [item] = await itemsOf(r.id)
    const res = await request(t.app)
      .post(`/api/v1/queue/${item.id}/close`)
      .set('Authorization', sup)
      .send({ reason: 'Harbour authority lights, passed to them', reportState: 'not_ours' })
    expect(res.status).toBe(204)
    expect((await publicStatus(r.ref)).state).toBe('not_ours')
    const other = await t
      .db('queueItems')
      .where({ state: 'open' })
      .whereNot('kind', 'public_report')
      .first('id')
    const bad = await request(t.app)
      .post(`/api/v1/queue/${other.id}/close`)
      .set('Authorization', sup)
      .send({ reason: 'No report here', reportState: 'fixed' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details.fields[0].path).toBe('body.reportState')
    expect((await t.db('queueItems').where({ id: other.id }).first('state')).state).toBe('open')
  })

  it('marks a report merged into another item as already reported, and does not reopen it', async () => {
    const a = await report({ street: 'Abbey Green', description: 'The big tree is dark tonight.' })
    const b = await report({ street: 'Abbey Green', description: 'Tree by the bench has no lights.' })
    const [into] = await itemsOf(a.id)
    const [dup] = await itemsOf(b.id)
    const res = await request(t.app)
      .post('/api/v1/queue/merge')
      .set('Authorization', sup)
      .send({ into: into.id, ids: [dup.id] })
    expect(res.status).toBe(204)
    await twoRefreshes()
    expect((await itemsOf(b.id)).map((i) => i.state)).toEqual(['merged'])
    expect(await publicStatus(b.ref)).toMatchObject({ state: 'duplicate', stateLabel: 'Already reported' })
    expect((await publicStatus(a.ref)).state).toBe('received')
  })
})

describe('a visit that fixes a reported string', () => {
  it('closes the report item with the visit, the reporter sees Fixed, and the job opens nothing new', async () => {
    const s = await t
      .db('strings as s')
      .join('stringTypes as ty', 'ty.id', 's.typeId')
      .where({ 'ty.code': 'CAT-F20', 's.status': 'lit', 's.lampsOut': 0 })
      .orderBy('s.id', 'desc')
      .first('s.id', 's.assetTag')
    const visit = (body: Record<string, unknown>) =>
      request(t.app)
        .post('/api/v1/visits')
        .set('Authorization', crew)
        .set('Idempotency-Key', randomUUID())
        .send({ stringId: s.id, ...body })
    // 2 shorted of 20 × 12 V on 230 V: 230 / (18 × 12) = 1.065 ≥ 1.05 (trade-reference §2–3) → replace now.
    expect((await visit({ failedFound: 2, replaced: 0 })).body.string.status).toBe('replace')
    const r = await report({ tag: s.assetTag, description: 'Two lamps out in the middle.' })
    const [item] = await itemsOf(r.id)
    expect(item).toMatchObject({ state: 'open', stringId: s.id })
    const fixed = await visit({
      failedFound: 0,
      replaced: 2,
      noIsolationReason: 'Isolated at the pillar by the council team.',
    })
    expect(fixed.status).toBe(201)
    expect(fixed.body.string.status).toBe('lit')
    await twoRefreshes()
    const items = await itemsOf(r.id)
    expect(items).toHaveLength(1)
    expect(items[0]).toMatchObject({ state: 'closed', closedByVisitId: fixed.body.id, closeReason: null })
    expect(await publicStatus(r.ref)).toMatchObject({ state: 'fixed', stateLabel: 'Fixed' })
  })
})
