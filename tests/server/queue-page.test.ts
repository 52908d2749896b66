// The queue in pages (issue 13 part 7): sorted and counted in SQL, filters on the server.
// Hand-worked scores follow server/services/queue/score.ts's weights (the team's own judgement,
// common practice, no source): risk + 5 × site importance + 25 × share of the response time used.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let sup: string
let siteId: number
const ids: Record<string, number> = {}
const H = 3_600_000

beforeAll(async () => {
  t = await makeTestApp()
  sup = `Bearer ${await t.token('supervisor')}`
  const client = await t.db('clients').orderBy('id').first('id')
  // A site of its own (importance 5) so the filter holds only this test's items.
  ;[siteId] = await t.db('sites').insert({
    clientId: client.id,
    name: `Paging test square ${randomUUID().slice(0, 8)}`,
    kind: 'square',
    importance: 5,
    lat: 54.1,
    lng: -2.1,
  })
  const now = Date.now()
  const item = async (name: string, kind: string, severity: string, openedH: number, dueH: number) => {
    ;[ids[name]] = await t.db('queueItems').insert({
      kind,
      openKey: `paging-test:${randomUUID()}`,
      siteId,
      clientId: client.id,
      severity,
      state: 'open',
      openedAt: new Date(now + openedH * H),
      dueBy: new Date(now + dueH * H),
      summary: `Paging test ${name}`,
    })
  }
  // dark: 45 + 5×5 + 25 × (10 h used of 20 h) = 45 + 25 + 12.5 = 82.5
  await item('dark', 'dark', 'standard', -10, 10)
  // forecast: 30 + 25 + 25 × (1 h of 36 h) = 30 + 25 + 0.69… → 55.7
  await item('forecast', 'forecast_dark', 'standard', -1, 35)
  // RCD failed, past due: 50 + 25 + 25 × 1 (clock capped) = 100
  await item('rcd', 'rcd_failed', 'standard', -30, -6)
  // An emergency ranks first whatever its score: 30 + 25 + 0 = 55
  await item('emergency', 'forecast_dark', 'emergency', 0, 36)
})
afterAll(async () => {
  await t.db('queueItems').whereIn('id', Object.values(ids)).delete()
  await t.db('sites').where({ id: siteId }).delete()
  await t.close()
})

const get = (query: string) => request(t.app).get(`/api/v1/queue?${query}`).set('Authorization', sup)

describe('GET /queue in pages', () => {
  it('counts every item under the filter and pages them emergencies first, then by score', async () => {
    const p1 = await get(`siteId=${siteId}&pageSize=3`)
    expect(p1.status).toBe(200)
    expect(p1.body).toMatchObject({ total: 4, page: 1, pageSize: 3 })
    expect(p1.body.items.map((i: { id: number }) => i.id)).toEqual([ids.emergency, ids.rcd, ids.dark])
    // The hand-worked scores above.
    expect(p1.body.items.map((i: { score: number }) => i.score)).toEqual([55, 100, 82.5])
    const p2 = await get(`siteId=${siteId}&pageSize=3&page=2`)
    expect(p2.body).toMatchObject({ total: 4, page: 2 })
    expect(p2.body.items.map((i: { id: number; score: number }) => [i.id, i.score])).toEqual([
      [ids.forecast, 55.7],
    ])
    const p3 = await get(`siteId=${siteId}&pageSize=3&page=3`)
    expect(p3.body).toMatchObject({ total: 4, items: [] })
  })

  it('applies the kind filter before counting', async () => {
    const res = await get(`siteId=${siteId}&kind=forecast_dark`)
    expect(res.body.total).toBe(2)
    expect(res.body.items.map((i: { id: number }) => i.id)).toEqual([ids.emergency, ids.forecast])
  })

  it('pages the whole demo queue without a gap or a repeat, in the order of the shown scores', async () => {
    const open = Number((await t.db('queueItems').where({ state: 'open' }).count({ n: '*' }))[0].n)
    const seen: { id: number; score: number; severity: string }[] = []
    for (let page = 1; ; page++) {
      const res = await get(`pageSize=7&page=${page}`)
      expect(res.body.total).toBe(open)
      if (!res.body.items.length) break
      seen.push(...res.body.items)
    }
    expect(seen).toHaveLength(open)
    expect(new Set(seen.map((i) => i.id)).size).toBe(open)
    // The SQL order agrees with the score each item shows (score.ts): never a higher one further down.
    const rank = (i: { score: number; severity: string }) => (i.severity === 'emergency' ? 1000 : 0) + i.score
    for (let k = 1; k < seen.length; k++) expect(rank(seen[k])).toBeLessThanOrEqual(rank(seen[k - 1]))
  })

  it('refuses a page of more than 100 items and a page 0 with validation_failed', async () => {
    expect((await get('pageSize=101')).body.error.code).toBe('validation_failed')
    expect((await get('page=0')).status).toBe(400)
  })
})
