// Lamp age kept as exposure (issue 11 part 4): the migration's conversion of burning hours, and the
// hours a visit adds at the ratio in force before it changes the string.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { exposureOf, makeFixture, makeString, type Fixture } from './engine-fixtures'
import { convertLampAge } from '../../migrations/20261202000100_engine_second_edition'

let t: TestApp
let f: Fixture
let crew: string
const tag = Date.now().toString(36).toUpperCase()
beforeAll(async () => {
  t = await makeTestApp()
  f = await makeFixture(t.db, tag)
  crew = `Bearer ${await t.token('crew')}`
})
afterAll(() => t.close())

// Hand calculation (trade-reference §2–3, voltage share; life ∝ r^−d, Wikipedia "Lamp rerating"):
// the fixture's 20 × 12 V lamps on 240 V with one shorted: 19 lamps in circuit, 228 V rated,
// r = 240 / 228 = 20 / 19 = 1.0526316; ln r = 0.0512933.
//   d = 13 (the lamps):     13 × 0.0512933 = 0.666813, e^0.666813 = 1.948019
//   d = 16 (the fuse lamp): 16 × 0.0512933 = 0.820693, e^0.820693 = 2.272073
const R13 = 1.948019
const R16 = 2.272073

describe('the migration converts burning hours to exposure', () => {
  it('takes each class at its own exponent, a dark string at its lamps-lit ratio, and stamps the time', async () => {
    const burning = await makeString(t.db, f, tag, { lampsOut: 1, lampAgeHours: 1000, status: 'replace' })
    // Fuse lamp failed: dark now; its lamps burned with the fuse intact and none shorted, r = 240 / 240 = 1.
    const dark = await makeString(t.db, f, tag, {
      fuseFailed: true,
      dark: true,
      lampAgeHours: 1000,
      status: 'dark',
    })
    const now = new Date('2026-12-02T12:00:00Z')
    // Only rows without exposure (the demo's have their own; other suites' new strings may be among them).
    expect(await convertLampAge(t.db, now)).toBeGreaterThanOrEqual(2)
    // 1000 h × 1.948019 = 1948.02 h; 1000 h × 2.272073 = 2272.07 h.
    const e = await exposureOf(t.db, burning)
    expect(e[0]).toBeCloseTo(1948.02, 1)
    expect(e[1]).toBeCloseTo(2272.07, 1)
    // r = 1: exposure equals burning hours, 1000 h each.
    expect(await exposureOf(t.db, dark)).toEqual([1000, 1000])
    const row = await t.db('strings').where({ id: burning }).first('exposureAt', 'lampAgeHours')
    expect(new Date(row.exposureAt).toISOString()).toBe(now.toISOString())
    expect(row.lampAgeHours).toBe(1000) // burning hours stay as they were
  })
})

describe('a visit adds the hours burned since the last change', () => {
  it('adds 2 nights × 7 h at the ratio before the visit, then records the new count', async () => {
    const twoDaysAgo = new Date(Date.now() - 48 * 3_600_000)
    const id = await makeString(t.db, f, tag, {
      lampsOut: 1,
      status: 'replace',
      replaceNow: true,
      lampAgeHours: 1000,
      lampExposure: JSON.stringify([500, 800]),
      exposureAt: twoDaysAgo,
    })
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId: id, failedFound: 1, replaced: 0 })
    expect(res.status).toBe(201)
    // Burning hours: 16:00–23:00 = 7 h a night × 2 days = 14 h (plus the test's few seconds, < 0.001 h).
    // Exposure: 500 + 14 × 1.948019 = 527.27 h; 800 + 14 × 2.272073 = 831.81 h. Age: 1000 + 14 = 1014 h.
    const e = await exposureOf(t.db, id)
    expect(e[0]).toBeCloseTo(500 + 14 * R13, 1)
    expect(e[1]).toBeCloseTo(800 + 14 * R16, 1)
    const row = await t.db('strings').where({ id }).first('lampAgeHours', 'lampsOut', 'exposureAt')
    expect(row.lampAgeHours).toBe(1014)
    expect(row.lampsOut).toBe(2)
    expect(Date.now() - new Date(row.exposureAt).getTime()).toBeLessThan(60_000)
    // The string page shows the same figures (it adds only the seconds since).
    const page = await request(t.app).get(`/api/v1/strings/${id}`).set('Authorization', crew)
    expect(page.status).toBe(200)
    expect(page.body.lampAgeHours).toBe(1014)
    expect(page.body.lampExposure).toEqual([527, 832])
  })

  it('adds nothing for a dark string, and a new fuse lamp starts its class from 0', async () => {
    const id = await makeString(t.db, f, tag, {
      fuseFailed: true,
      dark: true,
      status: 'dark',
      replaceNow: true,
      lampAgeHours: 1000,
      lampExposure: JSON.stringify([500, 800]),
      exposureAt: new Date(Date.now() - 48 * 3_600_000),
    })
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({
        stringId: id,
        failedFound: 0,
        replaced: 0,
        fuseReplaced: true,
        noIsolationReason: 'Isolated at the feeder pillar by the council electrician.',
      })
    expect(res.status).toBe(201)
    expect(res.body.string.status).toBe('lit')
    // Dark for the two days: no burning, so the 19 lamps keep 500 h; the one fuse lamp is new: 0 h.
    expect(await exposureOf(t.db, id)).toEqual([500, 0])
    expect((await t.db('strings').where({ id }).first('lampAgeHours')).lampAgeHours).toBe(1000)
  })
})
