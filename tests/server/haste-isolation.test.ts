// The isolation audit catches haste (issue 12 part 4). Every threshold is a setting in
// shared/isolation-timing.ts marked "common practice, no source"; the expected findings below are
// worked out by hand from the hand-chosen stamps against those settings:
//   lock_off → test_dead ≥ 25 s, prove_tester → test_dead ≥ 10 s, test_dead → reprove_tester ≥ 5 s,
//   reprove_tester → remove_lock ≥ 60 s; prove_tester → reprove_tester under 15 s is serious.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { isolationFindings } from '../../server/services/isolation-findings'

// Stamps in seconds after the first step, in the order of shared/vocab/visits.ts isolationSteps:
// identify, isolate, lock_off, prove_tester, test_dead, reprove_tester, remove_lock, re_energise,
// functional_check, rcd_test.
const ORDER = [
  'identify',
  'isolate',
  'lock_off',
  'prove_tester',
  'test_dead',
  'reprove_tester',
  'remove_lock',
  're_energise',
  'functional_check',
  'rcd_test',
] as const
/** Every step 2 s after the one before. */
const HASTY = [0, 2, 4, 6, 8, 10, 12, 14, 16, 18]
/** A careful night: lock_off→test_dead 90 s, prove→test 30 s, test→re-prove 15 s, work 20 min. */
const REALISTIC = [0, 60, 120, 180, 210, 225, 1425, 1440, 1500, 1560]
/** Only the dead test is quick: prove→test 186−180 = 6 s (< 10); test→re-prove 196−186 = 10 s (≥ 5);
 * prove→re-prove 196−180 = 16 s (≥ 15, so not serious); lock_off→test_dead 186−120 = 66 s (≥ 25);
 * re-prove→remove lock 1396−196 = 1200 s (≥ 60). */
const ONE_QUICK = [0, 60, 120, 180, 186, 196, 1396, 1410, 1470, 1530]

const steps = (base: number, offsets: number[]) =>
  ORDER.map((step, i) => ({
    step,
    doneAt: new Date(base + offsets[i] * 1000).toISOString(),
    ...(step === 'rcd_test' ? { value: '22 ms' } : {}),
  }))

/** The record as the findings read it: lock and tester named, every step there, an RCD trip time. */
const record = (offsets: number[]) => ({
  state: 'restored',
  lockId: 'L-7',
  testerId: 'T-3',
  steps: steps(Date.UTC(2026, 11, 2, 20), offsets).map((s) => ({ ...s, value: s.value ?? null })),
})

describe('haste findings (pure)', () => {
  it('steps 2 s apart: a serious finding for the test sequence and a minor one for the other gaps', () => {
    // prove 6 s → re-prove 10 s: 4 s < 15 s → serious. lock_off 4 s → test_dead 8 s: 4 s < 25 s;
    // re-prove 10 s → remove lock 12 s: 2 s < 60 s → both in the minor finding.
    const f = isolationFindings(record(HASTY))
    expect(f.map((x) => [x.code, x.severity])).toEqual([
      ['hasty_test_sequence', 'serious'],
      ['hasty_steps', 'minor'],
    ])
    expect(f[0].message).toContain('within 4 s')
    expect(f[1].message).toContain('lock-off to dead test 4 s (at least 25 s)')
    expect(f[1].message).toContain('re-proving to removing the lock (the work itself) 2 s (at least 60 s)')
    // The gaps inside the rushed sequence are not repeated in the minor finding.
    expect(f[1].message).not.toContain('proving the tester to dead test')
    expect(f[1].message).not.toContain('dead test to re-proving')
  })

  it('realistic gaps: no finding at all', () => {
    expect(isolationFindings(record(REALISTIC))).toEqual([])
  })

  it('gaps exactly at the minimums are not findings; the threshold is "under", not "at"', () => {
    // lock_off 60 → test_dead 85 = 25 s; prove 75 → test_dead 85 = 10 s; test_dead 85 → re-prove 90
    // = 5 s; prove 75 → re-prove 90 = 15 s; re-prove 90 → remove lock 150 = 60 s: each equals its minimum.
    expect(isolationFindings(record([0, 30, 60, 75, 85, 90, 150, 160, 200, 230]))).toEqual([])
  })

  it('one quick dead test inside a 16 s sequence: minor only', () => {
    const f = isolationFindings(record(ONE_QUICK))
    expect(f.map((x) => [x.code, x.severity])).toEqual([['hasty_steps', 'minor']])
    expect(f[0].message).toContain('proving the tester to dead test 6 s (at least 10 s)')
  })
})

let t: TestApp
let safety: string
let crew: string
let stringId: number
// A day no other test uses; its records are this file's own and are cleared before it runs. In
// February London is on UTC, so 18:00Z–18:40Z is inside 2001-02-03 on the app's clock.
const DAY = '2001-02-03'
const ids: Record<string, number> = {}

async function clearDay() {
  const old = (
    await t
      .db('isolations')
      .where('startedAt', '>=', new Date(`${DAY}T00:00:00Z`))
      .where('startedAt', '<', new Date('2001-02-04T00:00:00Z'))
      .select('id')
  ).map((r: { id: number }) => r.id)
  if (old.length) {
    await t.db('isolationSteps').whereIn('isolationId', old).delete()
    await t.db('isolations').whereIn('id', old).delete()
  }
}

async function post(startUtc: string, offsets: number[]) {
  const res = await request(t.app)
    .post('/api/v1/isolations')
    .set('Authorization', crew)
    .set('Idempotency-Key', randomUUID())
    .send({ stringId, lockId: 'L-7', testerId: 'T-3', steps: steps(Date.parse(startUtc), offsets) })
  expect(res.status).toBe(201)
  return res.body.id as number
}

const list = (query: string) =>
  request(t.app).get(`/api/v1/isolations?from=${DAY}&to=${DAY}&${query}`).set('Authorization', safety)
const order = (body: { items: { id: number }[] }) =>
  body.items.map((i) => Object.keys(ids).find((k) => ids[k] === i.id))

beforeAll(async () => {
  t = await makeTestApp()
  safety = `Bearer ${await t.token('safety')}`
  crew = `Bearer ${await t.token('crew')}`
  stringId = (await t.db('strings').orderBy('id').first('id')).id
  await clearDay()
  // Five records, hand-ranked: B and E serious (2 s apart), C minor (one quick test), A and D none.
  ids.A = await post(`${DAY}T18:00:00Z`, REALISTIC)
  ids.B = await post(`${DAY}T18:10:00Z`, HASTY)
  ids.C = await post(`${DAY}T18:20:00Z`, ONE_QUICK)
  ids.D = await post(`${DAY}T18:30:00Z`, REALISTIC)
  ids.E = await post(`${DAY}T18:40:00Z`, HASTY)
})
afterAll(async () => {
  await clearDay()
  await t.close()
})

describe('isolation list: filter, order and pages on the server', () => {
  it('a record stamped 2 s apart comes back with the serious haste finding; a careful one with none', async () => {
    const res = await list('review=all&pageSize=100')
    expect(res.status).toBe(200)
    const byId = new Map(res.body.items.map((i: { id: number }) => [i.id, i]))
    const codes = (id: number) =>
      (byId.get(id) as { findings: { code: string; severity: string }[] }).findings.map((f) => [
        f.code,
        f.severity,
      ])
    expect(codes(ids.B)).toEqual([
      ['hasty_test_sequence', 'serious'],
      ['hasty_steps', 'minor'],
    ])
    expect(codes(ids.A)).toEqual([])
  })

  it('orders worst first, then newest, and counts by hand', async () => {
    const res = await list('')
    // Serious E (18:40), B (18:10); minor C; none D (18:30), A (18:00). Counts: 5 records, 3 with a
    // finding (B, C, E), 2 serious (B, E).
    expect(order(res.body)).toEqual(['E', 'B', 'C', 'D', 'A'])
    expect(res.body).toMatchObject({
      total: 5,
      page: 1,
      pageSize: 20,
      counts: { all: 5, any: 3, serious: 2 },
    })
    const newest = await list('sort=newest')
    expect(order(newest.body)).toEqual(['E', 'D', 'C', 'B', 'A'])
  })

  it('filters to records with findings, and to serious ones', async () => {
    const any = await list('findings=any')
    expect(order(any.body)).toEqual(['E', 'B', 'C'])
    expect(any.body.total).toBe(3)
    const serious = await list('findings=serious')
    expect(order(serious.body)).toEqual(['E', 'B'])
    expect(serious.body.total).toBe(2)
  })

  it('pages: 5 records two a page are pages of 2, 2 and 1, total 5 on each', async () => {
    const pages = await Promise.all([1, 2, 3].map((p) => list(`pageSize=2&page=${p}`)))
    expect(pages.map((p) => order(p.body))).toEqual([['E', 'B'], ['C', 'D'], ['A']])
    for (const p of pages) expect(p.body.total).toBe(5)
    const past = await list('pageSize=2&page=4')
    expect(past.body.items).toEqual([])
  })

  it('refuses a reversed period and bad filters with a code', async () => {
    const reversed = await request(t.app)
      .get('/api/v1/isolations?from=2001-02-04&to=2001-02-03')
      .set('Authorization', safety)
    expect(reversed.status).toBe(400)
    expect(reversed.body.error.code).toBe('date_range_reversed')
    const bad = await list('findings=some&pageSize=0')
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('validation_failed')
  })

  it('a crew member gets 403 on the safety list', async () => {
    const res = await request(t.app).get('/api/v1/isolations').set('Authorization', crew)
    expect(res.status).toBe(403)
  })
})

describe('approving a record with a serious finding', () => {
  it('needs a note saying why; a record with no finding does not', async () => {
    const bare = await request(t.app)
      .post(`/api/v1/isolations/${ids.E}/review`)
      .set('Authorization', safety)
      .send({ decision: 'approved' })
    expect(bare.status).toBe(400)
    expect(bare.body.error.code).toBe('approval_note_required')
    const why = await request(t.app)
      .post(`/api/v1/isolations/${ids.E}/review`)
      .set('Authorization', safety)
      .send({ decision: 'approved', note: 'Phone clock was wrong; watched the test on site.' })
    expect(why.status).toBe(204)
    const clean = await request(t.app)
      .post(`/api/v1/isolations/${ids.D}/review`)
      .set('Authorization', safety)
      .send({ decision: 'approved' })
    expect(clean.status).toBe(204)
    // Two of the five are decided now: the default "to review" list holds the other three.
    const pending = await list('')
    expect(order(pending.body)).toEqual(['B', 'C', 'A'])
  })
})
