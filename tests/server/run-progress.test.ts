// Issue 14 (crew screens): after a visit, each stop on the crew's run reads done, still open or new
// fault found, worked out from the visits logged on its string since the run was published; visits
// from before the run was published do not count. The states are the issue's own words.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { refreshQueue } from '../../server/jobs/refresh-queue'

let t: TestApp
let sup: string
let crew: string
// A day of its own, so no other test's run for today is replaced.
const date = new Date(Date.now() + 9 * 86_400_000).toISOString().slice(0, 10)

beforeAll(async () => {
  t = await makeTestApp()
  sup = `Bearer ${await t.token('supervisor')}`
  crew = `Bearer ${await t.token('crew')}`
  await refreshQueue(t.db)
})
afterAll(() => t.close())

interface Stop {
  itemId: number
  stringId: number
  progress?: { state: string; statusAfter: string | null; lampsOutAfter: number | null; visits: number }
}

const visit = (body: Record<string, unknown>) =>
  request(t.app)
    .post('/api/v1/visits')
    .set('Authorization', crew)
    .set('Idempotency-Key', randomUUID())
    .send(body)

describe('stop progress on the crew run', () => {
  it('reads to do, done, still open and new fault found, counting only visits since publishing', async () => {
    // Strings to be replaced now, each with its open item: lamps out (not dark, fuse lamp whole) at
    // sites open at any hour (Lantern carries a platform). Some may be refused (a structure without a
    // valid approval): four that the run takes are enough.
    const picked = await t
      .db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .join('queueItems as q', 'q.stringId', 's.id')
      .whereNull('s.archivedAt')
      .where({ 's.status': 'replace', 's.dark': false, 's.fuseFailed': false })
      .where({ 'q.kind': 'replace_now', 'q.state': 'open' })
      .where('s.lampsOut', '>', 0)
      .whereNull('si.accessFrom')
      .orderBy('s.id')
      .select('s.id', 's.lampsOut', 'q.id as itemId')

    const crews = (await request(t.app).get('/api/v1/crews').set('Authorization', sup)).body.items
    const lantern = crews.find((c: { name: string }) => c.name === 'Lantern')
    const pub = await request(t.app)
      .post('/api/v1/runs/publish')
      .set('Authorization', sup)
      .send({ date, runs: [{ crewId: lantern.id, itemIds: picked.map((p) => p.itemId) }] })
    expect(pub.status).toBe(200)
    const taken = new Set(
      pub.body.runs.flatMap((r: { stops: { itemId: number }[] }) => r.stops.map((st) => st.itemId)),
    )
    const onRun = picked.filter((p) => taken.has(p.itemId))
    expect(onRun.length).toBeGreaterThanOrEqual(4)
    const [fixed, untouched, tried, worse] = onRun

    // Made an hour before the run was published (sent late from a phone): not a visit on this run.
    const early = await visit({
      stringId: tried.id,
      failedFound: 1,
      replaced: 0,
      visitedAt: new Date(Date.now() - 3_600_000).toISOString(),
    })
    expect(early.status).toBe(201)

    const mine = async () => {
      const res = await request(t.app).get(`/api/v1/runs/mine?date=${date}`).set('Authorization', crew)
      expect(res.status).toBe(200)
      return new Map((res.body.run.stops as Stop[]).map((s) => [s.stringId, s.progress]))
    }
    const before = await mine()
    for (const p of onRun) expect(before.get(p.id)).toMatchObject({ state: 'todo', visits: 0 })

    // Every lamp replaced: lit, the item closes, the stop is done.
    expect(
      (
        await visit({
          stringId: fixed.id,
          failedFound: 0,
          replaced: fixed.lampsOut,
          noIsolationReason: 'Isolated at the feeder pillar by the client',
        })
      ).body.string.status,
    ).toBe('lit')
    // Visited, nothing replaced (no lamps in the van): still to be replaced, the stop stays open.
    expect((await visit({ stringId: tried.id, failedFound: 0, replaced: 0 })).body.string.status).toBe(
      'replace',
    )
    // Visited and one more lamp found out: a new fault, still needing work.
    expect((await visit({ stringId: worse.id, failedFound: 1, replaced: 0 })).body.string.status).toBe(
      'replace',
    )

    const after = await mine()
    expect(after.get(fixed.id)).toMatchObject({
      state: 'done',
      statusAfter: 'lit',
      lampsOutAfter: 0,
      visits: 1,
    })
    expect(after.get(untouched.id)).toMatchObject({ state: 'todo', visits: 0 })
    expect(after.get(tried.id)).toMatchObject({ state: 'open', statusAfter: 'replace', visits: 1 })
    expect(after.get(worse.id)).toMatchObject({
      state: 'new_fault',
      statusAfter: 'replace',
      lampsOutAfter: worse.lampsOut + 1,
    })

    // Published again mid-shift (the same stops, as when one is added): what is done stays done.
    const again = await request(t.app)
      .post('/api/v1/runs/publish')
      .set('Authorization', sup)
      .send({ date, runs: [{ crewId: lantern.id, itemIds: picked.map((p) => p.itemId) }] })
    expect(again.status).toBe(200)

    // The supervisor's view of the same run reads the same.
    const board = await request(t.app).get(`/api/v1/runs?date=${date}`).set('Authorization', sup)
    const run = board.body.runs.find((r: { crewId: number }) => r.crewId === lantern.id)
    const states = new Map((run.stops as Stop[]).map((s) => [s.stringId, s.progress?.state]))
    expect([fixed, untouched, tried, worse].map((p) => states.get(p.id))).toEqual([
      'done',
      'todo',
      'open',
      'new_fault',
    ])
  })
})
