// GET /audit: who changed what and when, with before and after; filters, server paging, days on the
// app's clock, and who may read it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let manager: string
let managerId: number
let adminId: number
const E = 'audit_fixture'

const get = (query: string, who = manager) =>
  request(t.app).get(`/api/v1/audit?${query}`).set('Authorization', who)

beforeAll(async () => {
  t = await makeTestApp()
  manager = `Bearer ${await t.token('manager')}`
  managerId = (await t.db('users').where({ email: 'manager@example.org' }).first('id')).id
  adminId = (await t.db('users').where({ email: 'admin@example.org' }).first('id')).id
  // 30 rows, one an hour from 10 Nov 2026 00:00 UTC: entity ids cycle 1, 2, 3; the manager wrote
  // the even hours, the admin the odd ones.
  const rows = Array.from({ length: 30 }, (_, i) => ({
    at: new Date(Date.UTC(2026, 10, 10, i)),
    userId: i % 2 === 0 ? managerId : adminId,
    action: `step-${i}`,
    entity: E,
    entityId: (i % 3) + 1,
    details: JSON.stringify({ n: i }),
  }))
  await t.db('auditLog').insert(rows)
  await t.db('auditLog').insert([
    // 23:30 UTC on 1 July is 00:30 on 2 July in London (BST, UTC+1 from the last Sunday of March
    // to the last Sunday of October: UK Summer Time Order, gov.uk "When do the clocks change").
    { at: new Date('2026-07-01T23:30:00Z'), userId: null, action: 'late', entity: 'audit_zone', entityId: 1 },
    {
      at: new Date('2026-07-05T12:00:00Z'),
      userId: adminId,
      action: 'secret',
      entity: 'audit_zone',
      entityId: 2,
      details: JSON.stringify({ email: 'x@example.org', password: 'hunter2hunter2', tokenHash: 'abc' }),
    },
  ])
})
afterAll(() => t.close())

describe('GET /audit', () => {
  it('shows who, when and the record before and after, for a real edit of a client', async () => {
    const client = await t
      .db('clients')
      .where({ name: 'Wrenfold Town Council' })
      .first('id', 'version', 'emergencyPhone')
    const edit = await request(t.app)
      .patch(`/api/v1/clients/${client.id}`)
      .set('Authorization', manager)
      .send({ version: client.version, emergencyPhone: '0800 000 222' })
    expect(edit.status).toBe(200)
    const res = await get(`entity=client&entityId=${client.id}`)
    expect(res.status).toBe(200)
    const e = res.body.items[0]
    expect(e).toMatchObject({ action: 'update', entity: 'client', entityId: client.id })
    expect(e.user).toMatchObject({ id: managerId, role: 'manager' })
    expect(e.before.emergencyPhone).toBe(client.emergencyPhone ?? null)
    expect(e.after.emergencyPhone).toBe('0800 000 222')
    expect(Date.now() - Date.parse(e.at)).toBeLessThan(10 * 60_000)
  })

  it('pages on the server, newest first, 25 to a page', async () => {
    const p1 = await get(`entity=${E}`)
    const p2 = await get(`entity=${E}&page=2`)
    expect(p1.body.total).toBe(30)
    expect(p1.body.items).toHaveLength(25)
    expect(p2.body.items).toHaveLength(5) // 30 − 25
    expect(p1.body.items[0].action).toBe('step-29') // the last hour written
    expect(p2.body.items.at(-1).action).toBe('step-0')
    const ids = new Set([...p1.body.items, ...p2.body.items].map((i: { id: number }) => i.id))
    expect(ids.size).toBe(30)
    expect(p1.body.entities).toEqual(expect.arrayContaining([E, 'audit_zone', 'client']))
  })

  it('filters by record and by user', async () => {
    // ids cycle 1, 2, 3 over hours 0…29: id 2 is hours 1, 4, …, 28 = 10 rows.
    const byId = await get(`entity=${E}&entityId=2&pageSize=100`)
    expect(byId.body.total).toBe(10)
    expect(byId.body.items.every((i: { entityId: number }) => i.entityId === 2)).toBe(true)
    // The manager wrote the 15 even hours.
    const byUser = await get(`entity=${E}&userId=${managerId}&pageSize=100`)
    expect(byUser.body.total).toBe(15)
    expect(byUser.body.items.every((i: { user: { id: number } }) => i.user.id === managerId)).toBe(true)
    const both = await get(`entity=${E}&entityId=2&userId=${managerId}`)
    expect(both.body.total).toBe(5) // id 2 at even hours: 4, 10, 16, 22, 28
  })

  it('reads days on the app’s clock (Europe/London)', async () => {
    const second = await get('entity=audit_zone&from=2026-07-02&to=2026-07-02')
    expect(second.body.items.map((i: { action: string }) => i.action)).toEqual(['late'])
    const first = await get('entity=audit_zone&from=2026-07-01&to=2026-07-01')
    expect(first.body.total).toBe(0)
  })

  it('never shows passwords or token hashes kept in details', async () => {
    const res = await get('entity=audit_zone&entityId=2')
    expect(res.body.items[0].after).toEqual({
      email: 'x@example.org',
      password: '(hidden)',
      tokenHash: '(hidden)',
    })
    expect(res.body.items[0].before).toBeNull()
  })

  it('refuses a reversed period and an id without its record kind', async () => {
    const reversed = await get('from=2026-11-10&to=2026-11-01')
    expect(reversed.status).toBe(400)
    expect(reversed.body.error.code).toBe('date_range_reversed')
    const noKind = await get('entityId=3')
    expect(noKind.status).toBe(400)
    expect(noKind.body.error.code).toBe('entity_required')
  })

  it('is read by managers, safety officers and admins; a crew member or supervisor gets 403', async () => {
    for (const role of ['safety', 'admin'] as const)
      expect((await get(`entity=${E}`, `Bearer ${await t.token(role)}`)).status).toBe(200)
    for (const role of ['crew', 'supervisor'] as const) {
      const res = await get(`entity=${E}`, `Bearer ${await t.token(role)}`)
      expect(res.status).toBe(403)
      expect(res.body.error.code).toBe('forbidden')
    }
  })
})
