// In-app notices: written by the change that concerns a user, read and marked only by that user.
// Expected counts are hand-counted from the steps of each test (one rejection → one notice, etc.).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomInt, randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let crew: string
let sup: string
let safety: string
beforeAll(async () => {
  t = await makeTestApp({ TRUST_PROXY: 'loopback' })
  crew = `Bearer ${await t.token('crew')}`
  sup = `Bearer ${await t.token('supervisor')}`
  safety = `Bearer ${await t.token('safety')}`
})
afterAll(() => t.close())

const notices = async (auth: string, query = '') =>
  (await request(t.app).get(`/api/v1/notices${query}`).set('Authorization', auth)).body as {
    items: {
      id: number
      kind: string
      title: string
      body: string | null
      link: string | null
      readAt: string | null
    }[]
    unread: number
    total: number
  }

describe('in-app notices', () => {
  it('tells the author of a rejected isolation once; only they can read it, and reading clears the count', async () => {
    const s = await t.db('strings').where({ status: 'lit' }).first('id')
    const t0 = Date.now() - 3_600_000
    const steps = ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester'].map(
      (step, i) => ({ step, doneAt: new Date(t0 + i * 60_000).toISOString() }),
    )
    const made = await request(t.app)
      .post('/api/v1/isolations')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId: s.id, steps })
    expect(made.status).toBe(201)
    const before = await notices(crew)
    const review = () =>
      request(t.app)
        .post(`/api/v1/isolations/${made.body.id}/review`)
        .set('Authorization', safety)
        .send({ decision: 'rejected', note: 'No lock recorded; see me before your next shift.' })
    expect((await review()).status).toBe(204)
    // Rejected a second time: still one notice (the decision did not change).
    expect((await review()).status).toBe(204)

    const after = await notices(crew)
    expect(after.unread).toBe(before.unread + 1)
    const mine = after.items.filter((n) => n.kind === 'isolation_rejected')
    expect(mine).toHaveLength(1)
    expect(mine[0].title).toContain(`#${made.body.id}`)
    expect(mine[0].body).toContain('No lock recorded')
    expect(mine[0].link).toBe(`/strings/${s.id}`)
    expect(mine[0].readAt).toBeNull()

    // Another user neither sees it nor can mark it read.
    const other = await notices(sup)
    expect(other.items.some((n) => n.id === mine[0].id)).toBe(false)
    const theirs = await request(t.app)
      .post('/api/v1/notices/read')
      .set('Authorization', sup)
      .send({ ids: [mine[0].id] })
    expect(theirs.status).toBe(200)
    expect(theirs.body.marked).toBe(0)
    expect((await notices(crew)).unread).toBe(before.unread + 1)

    const read = await request(t.app)
      .post('/api/v1/notices/read')
      .set('Authorization', crew)
      .send({ ids: [mine[0].id] })
    expect(read.status).toBe(200)
    expect(read.body).toEqual({ marked: 1, unread: before.unread })
    const all = await request(t.app)
      .post('/api/v1/notices/read')
      .set('Authorization', crew)
      .send({ all: true })
    expect(all.body.unread).toBe(0)
    expect((await notices(crew, '?unread=true')).items).toHaveLength(0)
  })

  it('answers 400 to a malformed read and 401 without a session', async () => {
    const bad = await request(t.app).post('/api/v1/notices/read').set('Authorization', crew).send({ ids: [] })
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('validation_failed')
    expect((await request(t.app).get('/api/v1/notices')).status).toBe(401)
  })

  it('tells the crew when a report is put on their run and when their published run changes', async () => {
    // Strings any crew can reach at any hour (a point, no platform; a site with no access window), so
    // the planner keeps both stops on the run.
    const easy = t
      .db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .whereNull('s.archivedAt')
      .where('s.geometry', 'point')
      .whereNull('si.accessFrom')
    const free = await easy
      .clone()
      .whereNotIn(
        's.id',
        t
          .db('reports')
          .whereIn('state', ['received', 'in_hand', 'scheduled'])
          .whereNotNull('stringId')
          .select('stringId'),
      )
      .orderBy('s.id')
      .limit(2)
      .select('s.assetTag')
    expect(free).toHaveLength(2)
    const file = async (tag: string, description: string) => {
      const res = await request(t.app)
        .post('/api/v1/reports')
        .set('X-Forwarded-For', `198.51.100.${randomInt(1, 255)}`)
        .send({ tag, description, formStartedAt: Date.now() - 60_000 })
      expect(res.status).toBe(201)
      const row = await t.db('reports').where({ ref: res.body.ref }).first('queueItemId')
      return { ref: res.body.ref as string, itemId: row.queueItemId as number }
    }
    const rep = await file(free[0].assetTag, 'Half the lights are out by the bus stop.')
    const other = await file(free[1].assetTag, 'The whole string is dark.')
    const crews = (await request(t.app).get('/api/v1/crews').set('Authorization', sup)).body.items
    const lantern = crews.find((c: { name: string }) => c.name === 'Lantern')
    // A day ahead, so no other test's run for today is touched.
    const date = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10)
    const publish = (itemIds: number[]) =>
      request(t.app)
        .post('/api/v1/runs/publish')
        .set('Authorization', sup)
        .send({ date, runs: [{ crewId: lantern.id, itemIds }] })
    await request(t.app).post('/api/v1/notices/read').set('Authorization', crew).send({ all: true })

    const first = await publish([rep.itemId, other.itemId])
    expect(first.status).toBe(200)
    const stops = first.body.runs[0].stops.map((s: { itemId: number }) => s.itemId)
    expect([...stops].sort()).toEqual([rep.itemId, other.itemId].sort())
    // A new run: each report put on it is news (2), the run itself is not a change.
    let got = (await notices(crew, '?unread=true')).items
    expect(got.map((n) => n.kind)).toEqual(['report_assigned', 'report_assigned'])
    const mine = got.find((n) => n.title.includes(rep.ref))!
    expect(mine.title).toContain(free[0].assetTag)
    expect(mine.body).toBe('The reporter says: Half the lights are out by the bus stop.')
    expect(mine.link).toBe('/run')

    // The same stops again: nothing changed, nothing new.
    expect((await publish(stops)).status).toBe(200)
    expect((await notices(crew, '?unread=true')).items).toHaveLength(2)

    // One stop removed from the published run: one "changed" notice.
    expect((await publish([rep.itemId])).status).toBe(200)
    got = (await notices(crew, '?unread=true')).items
    expect(got.map((n) => n.kind)).toEqual(['run_changed', 'report_assigned', 'report_assigned'])
    // The day in words as en-GB writes it (the test server's APP_LOCALE default): CLDR's en-GB
    // pattern for weekday + date is "E, d MMM y", e.g. "Fri, 4 Dec 2026" (CLDR, from memory). The
    // names come from Intl's own parts here, not from the app's formatter.
    const [y, m, d] = date.split('-').map(Number)
    const when = new Date(Date.UTC(y, m - 1, d, 12))
    const part = (o: Intl.DateTimeFormatOptions) =>
      new Intl.DateTimeFormat('en-GB', { ...o, timeZone: 'UTC' }).format(when)
    expect(got[0].title).toBe(
      `Your run for ${part({ weekday: 'short' })}, ${d} ${part({ month: 'short' })} ${y} has changed`,
    )
    expect(got[0].body).toContain('1 stop removed')
    // The supervisor who published is not told about their own change.
    expect((await notices(sup, '?unread=true')).items.some((n) => n.kind === 'run_changed')).toBe(false)
  })
})
