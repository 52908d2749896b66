// The incremental queue refresh (issue 13 item 2): a string's stored forecast is reused while the
// key of its inputs is unchanged, a visit or a type edit re-forecasts exactly the strings concerned,
// and the incremental path leaves the same open items as a full pass. The counts expected here are
// the strings each test changes by hand; the curve readings are worked out in the comments.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { makeFixture, makeString, type Fixture } from './engine-fixtures'
import { refreshQueue } from '../../server/jobs/refresh-queue'
import { chanceDarkWithin, compressCurve, shareDarkBy } from '../../server/jobs/forecast-curve'

let t: TestApp
let f: Fixture
const tag = `I${Date.now().toString(36).toUpperCase()}`
const ids: number[] = []
// Whole seconds: DATETIME columns keep no fraction.
const base = Math.ceil(Date.now() / 1000) * 1000
/** The test's clock: minutes after its start (refreshes at one instant judge alike). */
const at = (minutes: number) => new Date(base + minutes * 60_000)

const forecastAt = async (id: number) =>
  (await t.db('strings').where({ id }).first('forecastAt')).forecastAt as Date | null
const madeAt = async (when: Date) =>
  (await t.db('strings').where({ forecastAt: when }).whereNull('archivedAt').pluck('id')) as number[]

beforeAll(async () => {
  t = await makeTestApp()
  f = await makeFixture(t.db, tag)
  const fresh = { lampAgeHours: 0, lampExposure: JSON.stringify([0, 0]), exposureAt: at(0) }
  const worn = { lampAgeHours: 900, lampExposure: JSON.stringify([900, 900]), exposureAt: at(0) }
  for (const row of [fresh, fresh, worn]) ids.push(await makeString(t.db, f, tag, row))
  // Everything forecast once, then a second refresh at the same instant has nothing to do.
  await refreshQueue(t.db, at(1))
})
afterAll(() => t.close())

describe('the incremental refresh', () => {
  it('reuses every stored forecast when nothing changed', async () => {
    const before = await Promise.all(ids.map(forecastAt))
    const r = await refreshQueue(t.db, at(2))
    expect(r.forecasts).toBe(0)
    expect(await Promise.all(ids.map(forecastAt))).toEqual(before)
    expect(await madeAt(at(2))).toEqual([])
  })

  it('re-forecasts only the string a visit changed', async () => {
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', `Bearer ${await t.token('crew')}`)
      .set('Idempotency-Key', crypto.randomUUID())
      .send({ stringId: ids[0], failedFound: 0, replaced: 0 })
    expect(res.status).toBe(201)
    const r = await refreshQueue(t.db, at(3))
    // One visit: its string's exposure starts again from the visit, so its key changed; nothing else did.
    expect(r.forecasts).toBe(1)
    expect(await madeAt(at(3))).toEqual([ids[0]])
  })

  it('re-forecasts every string of a type when the type is edited, and no other', async () => {
    await t.db('stringTypes').where({ id: f.typeId }).update({ ratedLifeHours: 1200 })
    const r = await refreshQueue(t.db, at(4))
    expect(r.forecasts).toBe(3)
    expect((await madeAt(at(4))).sort((a, b) => a - b)).toEqual([...ids].sort((a, b) => a - b))
  })

  it('leaves the same open items as a full pass after changes made behind its back', async () => {
    // Changes no visit announced: a string set dark by hand, one archived, one new and worn.
    await t.db('strings').where({ id: ids[1] }).update({ status: 'dark', dark: true })
    await t
      .db('strings')
      .where({ id: ids[0] })
      .update({ archivedAt: at(5) })
    ids.push(
      await makeString(t.db, f, tag, {
        lampAgeHours: 950,
        lampExposure: JSON.stringify([950, 950]),
        exposureAt: at(5),
      }),
    )
    const openItems = () =>
      t
        .db('queueItems')
        .where('state', 'open')
        .orderBy('openKey')
        .select('openKey', 'kind', 'summary', 'dueBy')
    const r = await refreshQueue(t.db, at(6))
    // The new string only: the dark one is not forecast, the archived one not at all.
    expect(r.forecasts).toBe(1)
    const incremental = await openItems()
    expect(incremental.find((i) => i.openKey === `dark:string:${ids[1]}`)).toBeDefined()
    const full = await refreshQueue(t.db, at(6), { full: true })
    expect(full.forecasts).toBeGreaterThan(r.forecasts)
    expect(full.opened).toBe(0)
    expect(await openItems()).toEqual(incremental)
  })
})

describe('the age of a stored forecast', () => {
  it('judges from the stored curve within a day, and makes the forecast again after one', async () => {
    // Six hours on: nothing changed and 6 h is under the 12 h before any forecast is renewed.
    const soon = await refreshQueue(t.db, at(6 + 6 * 60))
    expect(soon.forecasts).toBe(0)
    // 25 hours on: over MAX_FORECAST_AGE_HOURS (24 h), so every live fixture string is forecast again.
    const later = at(6 + 25 * 60)
    await refreshQueue(t.db, later)
    const live = [ids[2], ids[3]]
    expect((await madeAt(later)).filter((id) => live.includes(id)).sort()).toEqual([...live].sort())
  })
})

describe('reading a stored curve as time passes', () => {
  // A curve by hand: F(0) = 0, F(10) = 0.2, F(20) = 0.6, F(30) = 0.6.
  const curve = compressCurve([
    { hours: 0, p: 0 },
    { hours: 10, p: 0.2 },
    { hours: 20, p: 0.6 },
    { hours: 25, p: 0.6 },
    { hours: 30, p: 0.6 },
  ])

  it('keeps only the points a linear reading needs', () => {
    // 25 h lies inside a flat run (0.6 before and after): dropped; its ends stay.
    expect(curve).toEqual([
      [0, 0],
      [10, 0.2],
      [20, 0.6],
      [30, 0.6],
    ])
  })

  it('reads the chance as it stands at the forecast, and the conditional chance later', () => {
    // At the forecast: F(10) = 0.2. Linear between points: F(15) = 0.2 + 0.4 × 5 / 10 = 0.4.
    expect(chanceDarkWithin(curve, 0, 10)).toBeCloseTo(0.2, 10)
    expect(shareDarkBy(curve, 15)).toBeCloseTo(0.4, 10)
    // 10 h on, the next 10 h: (F(20) − F(10)) / (1 − F(10)) = (0.6 − 0.2) / 0.8 = 0.5.
    expect(chanceDarkWithin(curve, 10, 10)).toBeCloseTo(0.5, 10)
    // Beyond the curve's last point there is no reading: the string is forecast again.
    expect(chanceDarkWithin(curve, 25, 10)).toBeNull()
  })
})
