// Issue 14: a supervisor wakes a snoozed item early, and publishing keeps only the supervisor's pins.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { refreshQueue } from '../../server/jobs/refresh-queue'

let t: TestApp
let sup: string
beforeAll(async () => {
  t = await makeTestApp()
  sup = `Bearer ${await t.token('supervisor')}`
  await refreshQueue(t.db)
})
afterAll(() => t.close())

const inAnHour = () => new Date(Date.now() + 3_600_000).toISOString()

describe('waking a snoozed item early', () => {
  it('opens it again at once and writes an audit row', async () => {
    const [item] = (await request(t.app).get('/api/v1/queue?pageSize=5').set('Authorization', sup)).body.items
    const snoozed = await request(t.app)
      .post(`/api/v1/queue/${item.id}/snooze`)
      .set('Authorization', sup)
      .send({ until: inAnHour(), reason: 'Waiting for the road to reopen' })
    expect(snoozed.status).toBe(204)

    const woken = await request(t.app).post(`/api/v1/queue/${item.id}/wake`).set('Authorization', sup)
    expect(woken.status).toBe(200)
    expect(woken.body).toEqual({ id: item.id, state: 'open' })
    const row = await t.db('queueItems').where({ id: item.id }).first('state', 'snoozedUntil')
    expect(row).toEqual({ state: 'open', snoozedUntil: null })
    const open = (await request(t.app).get('/api/v1/queue?state=open&pageSize=100').set('Authorization', sup))
      .body.items
    expect(open.some((i: { id: number }) => i.id === item.id)).toBe(true)
    expect(
      await t.db('auditLog').where({ action: 'wake', entity: 'queue_item', entityId: item.id }),
    ).toHaveLength(1)
  })

  it('refuses a crew member (403) and an item that is not snoozed (409)', async () => {
    const [item] = (await request(t.app).get('/api/v1/queue?state=open&pageSize=5').set('Authorization', sup))
      .body.items
    const wakes = async () => (await t.db('auditLog').where({ action: 'wake', entityId: item.id })).length
    const before = await wakes()
    const crew = await request(t.app)
      .post(`/api/v1/queue/${item.id}/wake`)
      .set('Authorization', `Bearer ${await t.token('crew')}`)
    expect(crew.status).toBe(403)
    const notSnoozed = await request(t.app).post(`/api/v1/queue/${item.id}/wake`).set('Authorization', sup)
    expect(notSnoozed.status).toBe(409)
    expect(notSnoozed.body.error.code).toBe('not_snoozed')
    expect(await wakes()).toBe(before)
  })
})

describe('publishing runs', () => {
  it('saves only the stops the supervisor pinned as pinned, so a re-optimise may move the rest', async () => {
    const queue = (await request(t.app).get('/api/v1/queue?pageSize=50').set('Authorization', sup)).body.items
      // Strings with no access window: any crew's shift can take them, so none is left unassigned.
      .filter(
        (i: { lat: number | null; string: unknown; site: { accessFrom: string | null } | null }) =>
          i.lat !== null && i.string && !i.site?.accessFrom,
      )
      .slice(0, 6)
    const crews = (await request(t.app).get('/api/v1/crews').set('Authorization', sup)).body.items
    const lantern = crews.find((c: { name: string }) => c.name === 'Lantern')
    const date = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10)
    const plan = await request(t.app)
      .post('/api/v1/runs/plan')
      .set('Authorization', sup)
      .send({ date, crewIds: [lantern.id], itemIds: queue.map((q: { id: number }) => q.id) })
    expect(plan.status).toBe(200)
    const itemIds = plan.body.runs[0].stops.map((s: { itemId: number }) => s.itemId)
    expect(itemIds.length).toBeGreaterThanOrEqual(2)
    const kept = itemIds[1]

    const pub = await request(t.app)
      .post('/api/v1/runs/publish')
      .set('Authorization', sup)
      .send({ date, runs: [{ crewId: lantern.id, itemIds }], pinnedItemIds: [kept] })
    expect(pub.status).toBe(200)
    const stops = pub.body.runs[0].stops as { itemId: number; pinned: boolean }[]
    expect(stops.map((s) => s.itemId)).toEqual(itemIds)
    expect(stops.filter((s) => s.pinned).map((s) => s.itemId)).toEqual([kept])

    const saved = (await request(t.app).get(`/api/v1/runs?date=${date}`).set('Authorization', sup)).body.runs
    const pinned = saved[0].stops.filter((s: { pinned: boolean }) => s.pinned)
    expect(pinned.map((s: { itemId: number }) => s.itemId)).toEqual([kept])

    // Published without pins (what the old client sent): nothing is pinned.
    const again = await request(t.app)
      .post('/api/v1/runs/publish')
      .set('Authorization', sup)
      .send({ date, runs: [{ crewId: lantern.id, itemIds }] })
    expect(again.status).toBe(200)
    expect(again.body.runs[0].stops.some((s: { pinned: boolean }) => s.pinned)).toBe(false)
  })
})
