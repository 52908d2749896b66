// Lamp stock: visits take what they fitted from the crew's van (once, even when replayed), transfers
// and corrections move counts with audit rows, and the usage report sums what the visits used.
// Expected counts are worked by hand from the counts each test sets first.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let crew: string
let supervisor: string
let stringId: number
let clientId: number
let vanId: number
let depotId: number
let lampId: number
let fuseId: number

// The demo catalogue's cross-street catenary (shared/lamp-catalogue.ts, CAT-F20): 19 shunted 12 V 0.5 A
// lamps and an 11 V 0.5 A fuse lamp; each rating is one stock item.
const LAMP = 'Lamp 12 V 0.5 A'
const FUSE = 'Fuse lamp 11 V 0.5 A'

const get = (path: string, auth: string) => request(t.app).get(`/api/v1${path}`).set('Authorization', auth)
const post = (path: string, auth: string, body: object) =>
  request(t.app).post(`/api/v1${path}`).set('Authorization', auth).send(body)

const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v)

async function count(locationId: number, itemId: number): Promise<number> {
  const res = await get(`/stock?locationId=${locationId}`, supervisor)
  expect(res.status).toBe(200)
  return res.body.items.find((l: { itemId: number }) => l.itemId === itemId).quantity
}

async function setCount(locationId: number, itemId: number, quantity: number) {
  const res = await post('/stock/adjustments', supervisor, {
    itemId,
    locationId,
    quantity,
    reason: 'Test count',
  })
  expect(res.status).toBe(201)
}

function relamp(key: string, body: object) {
  return request(t.app)
    .post('/api/v1/visits')
    .set('Authorization', crew)
    .set('Idempotency-Key', key)
    .send({ stringId, noIsolationReason: 'Dead section, proved dead at the feeder pillar.', ...body })
}

async function usage(itemId: number): Promise<number> {
  const res = await get(`/stock/usage?clientId=${clientId}`, supervisor)
  expect(res.status).toBe(200)
  return res.body.rows
    .filter((r: { itemId: number }) => r.itemId === itemId)
    .reduce((n: number, r: { quantity: number }) => n + r.quantity, 0)
}

beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
  supervisor = `Bearer ${await t.token('supervisor')}`
  // A lit catenary no other test file relamps (they take the first; this takes the last).
  const s = await t
    .db('strings as s')
    .join('stringTypes as ty', 'ty.id', 's.typeId')
    .join('sites as si', 'si.id', 's.siteId')
    .where({ 'ty.code': 'CAT-F20', 's.status': 'lit' })
    .orderBy('s.id', 'desc')
    .first('s.id', 'si.clientId')
  stringId = s.id
  clientId = s.clientId
  const mine = await get('/stock', crew)
  expect(mine.status).toBe(200)
  const lines = mine.body.items as {
    locationId: number
    locationKind: string
    itemId: number
    itemName: string
  }[]
  expect(new Set(lines.map((l) => l.locationKind))).toEqual(new Set(['van']))
  vanId = lines[0].locationId
  lampId = lines.find((l) => l.itemName === LAMP)!.itemId
  fuseId = lines.find((l) => l.itemName === FUSE)!.itemId
  const all = await get('/stock', supervisor)
  depotId = all.body.items.find((l: { locationKind: string }) => l.locationKind === 'depot').locationId
})
afterAll(() => t.close())

describe('stock', () => {
  it('a relamp of 3 takes 3 lamps from the crew van; the replayed visit takes none again', async () => {
    await setCount(vanId, lampId, 10)
    await setCount(vanId, fuseId, 4)
    const before = { lamp: await usage(lampId), fuse: await usage(fuseId) }
    const key = randomUUID()
    const body = { failedFound: 3, replaced: 3, fuseReplaced: true }
    expect((await relamp(key, body)).status).toBe(201)
    expect(await count(vanId, lampId)).toBe(7) // 10 − 3
    expect(await count(vanId, fuseId)).toBe(3) // 4 − 1
    // The phone sends the same visit again after losing the answer (offline replay).
    const again = await relamp(key, body)
    expect(again.status).toBe(200)
    expect(await count(vanId, lampId)).toBe(7)
    expect(await count(vanId, fuseId)).toBe(3)
    // The usage report sums what the visit used: 3 lamps and 1 fuse lamp more for this client.
    expect(await usage(lampId)).toBe(before.lamp + 3)
    expect(await usage(fuseId)).toBe(before.fuse + 1)
  })

  it('a van falling to its low level tells the supervisors once per crossing', async () => {
    await setCount(vanId, lampId, 6)
    const level = await request(t.app)
      .put('/api/v1/stock/low-levels')
      .set('Authorization', supervisor)
      .send({ itemId: lampId, locationId: vanId, lowAt: 5 })
    expect(level.status).toBe(200)
    const low = () => t.db('notices').where({ kind: 'low_stock' }).count({ n: '*' }).first()
    const n0 = Number((await low())!.n)
    expect((await relamp(randomUUID(), { failedFound: 2, replaced: 2 })).status).toBe(201)
    expect(await count(vanId, lampId)).toBe(4) // 6 − 2: crosses 5
    const n1 = Number((await low())!.n)
    expect(n1).toBeGreaterThan(n0)
    expect((await relamp(randomUUID(), { failedFound: 1, replaced: 1 })).status).toBe(201)
    expect(await count(vanId, lampId)).toBe(3) // already low: no second notice
    expect(Number((await low())!.n)).toBe(n1)
  })

  it('a transfer and a correction move the counts, each with its audit row', async () => {
    await setCount(depotId, lampId, 50)
    await setCount(vanId, lampId, 7)
    const moved = await post('/stock/transfers', supervisor, {
      itemId: lampId,
      fromLocationId: depotId,
      toLocationId: vanId,
      quantity: 5,
    })
    expect(moved.status).toBe(201)
    expect(moved.body.from.quantity).toBe(45) // 50 − 5
    expect(moved.body.to.quantity).toBe(12) // 7 + 5
    expect(await count(depotId, lampId)).toBe(45)
    const audit = await t
      .db('auditLog')
      .where({ action: 'stock_transfer', entityId: lampId })
      .orderBy('id', 'desc')
      .first()
    expect(json(audit.details)).toMatchObject({ movementId: moved.body.movementId, quantity: 5 })

    const fixed = await post('/stock/adjustments', crew, {
      itemId: lampId,
      locationId: vanId,
      quantity: 9,
      reason: 'Three broken in the box',
    })
    expect(fixed.status).toBe(201)
    expect(fixed.body.change).toBe(-3) // 12 found as 9
    expect(await count(vanId, lampId)).toBe(9)
    const row = await t
      .db('auditLog')
      .where({ action: 'stock_adjust', entityId: lampId })
      .orderBy('id', 'desc')
      .first()
    expect(json(row.details)).toMatchObject({ before: 12, after: 9, reason: 'Three broken in the box' })
  })

  it('refuses a transfer that would take a place below zero with 409, and changes nothing', async () => {
    await setCount(vanId, lampId, 2)
    const res = await post('/stock/transfers', crew, {
      itemId: lampId,
      fromLocationId: vanId,
      toLocationId: depotId,
      quantity: 3,
    })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('stock_insufficient')
    expect(await count(vanId, lampId)).toBe(2)
  })

  it('keeps a crew to its own van: no depot correction, no other van, bad input refused', async () => {
    const res = await post('/stock/adjustments', crew, {
      itemId: lampId,
      locationId: depotId,
      quantity: 1,
      reason: 'Counted',
    })
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('forbidden')
    expect((await get(`/stock?locationId=${depotId}`, crew)).status).toBe(403)
    const bad = await post('/stock/transfers', supervisor, {
      itemId: lampId,
      fromLocationId: depotId,
      toLocationId: depotId,
      quantity: 1,
    })
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('validation_failed')
    const missing = await post('/stock/transfers', supervisor, {
      itemId: 999_999,
      fromLocationId: depotId,
      toLocationId: vanId,
      quantity: 1,
    })
    expect(missing.status).toBe(404)
  })

  it('warns the planner and the load-out sheet when a run needs more lamps than the van holds', async () => {
    const crewId = (await t.db('users').where({ email: 'crew@example.org' }).first('crewId')).crewId
    // A stop on the crew's published run whose string is recorded now as 3 catenary lamps out.
    const stop = await t
      .db('runStops as rs')
      .join('runs as r', 'r.id', 'rs.runId')
      .join('strings as s', 's.id', 'rs.stringId')
      .join('stringTypes as ty', 'ty.id', 's.typeId')
      .where({ 'r.crewId': crewId, 'ty.code': 'CAT-F20' })
      .whereNot('s.id', stringId)
      .first('rs.queueItemId as id', 's.id as stringId', 'r.runDate')
    const item = { id: stop.id as number, stringId: stop.stringId as number }
    await t.db('strings').where({ id: item.stringId }).update({ lampsOut: 3, fuseFailed: false })
    await setCount(vanId, lampId, 1)
    const plan = await post('/runs/plan', supervisor, {
      date: stop.runDate,
      crewIds: [crewId],
      itemIds: [item.id],
    })
    expect(plan.status).toBe(200)
    const run = plan.body.runs[0]
    expect(run.stops.map((s: { stringId: number }) => s.stringId)).toContain(item.stringId)
    // 3 lamps out against 1 in the van: 2 short.
    expect(run.stockShortfalls).toContainEqual({ itemId: lampId, itemName: LAMP, need: 3, have: 1, short: 2 })

    const day = '2031-01-15'
    const [runId] = await t.db('runs').insert({ crewId, runDate: day, state: 'published', version: 1 })
    await t.db('runStops').insert({ runId, position: 1, queueItemId: item.id, stringId: item.stringId })
    const sheet = await get(`/stock/load-out?date=${day}`, crew)
    expect(sheet.status).toBe(200)
    expect(sheet.body.run).toMatchObject({ id: runId, stops: 1 })
    expect(sheet.body.lines[0]).toEqual({ itemId: lampId, itemName: LAMP, need: 3, have: 1, short: 2 })
    expect((await get(`/stock/load-out?date=${day}&crewId=${crewId + 1000}`, crew)).status).toBe(403)
  })
})
