// The string page's lead forecast (server/services/string-outlook.ts): read from the curve the queue
// judges by while it fits the string, so the page and the queue give the same chance and opening a
// string runs no simulation; worked out by the page only when a visit has changed the string since.
// These are the product's own promises (common practice, no source); the engine's figures themselves
// are checked against published values in tests/shared/engine.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { litCatenaries, makeTestApp, type TestApp } from './helpers'
import { refreshForecasts } from '../../server/jobs/refresh-forecasts'
import { clearForecastCache, forecastCacheStats } from '../../server/services/forecast-cache'
import { storedOutlook } from '../../server/services/string-outlook'

let t: TestApp
let crew: string
let stringId: number
beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
  ;[stringId] = await litCatenaries(t.db, 1)
})
afterAll(() => t.close())

const detail = () => request(t.app).get(`/api/v1/strings/${stringId}`).set('Authorization', crew)

describe("the string page's lead forecast", () => {
  it('is the chance the queue judged, read with no simulation', async () => {
    // Every string judged now (`full`), whatever earlier tests left stored.
    const fc = await refreshForecasts(t.db, new Date(), { full: true })
    const judged = fc.risks.find((r) => r.id === stringId)
    expect(judged).toBeDefined()
    clearForecastCache()
    const res = await detail()
    expect(res.status).toBe(200)
    expect(res.body.outlook.source).toBe('queue')
    expect(res.body.outlook.pDark72).toBeCloseTo(judged!.pDark72, 3)
    expect(forecastCacheStats().misses).toBe(0)
  })

  it("is the page's own once a visit has changed the string, and the queue's again after the job", async () => {
    const visit = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId, failedFound: 1, replaced: 0 })
    expect(visit.status).toBe(201)
    clearForecastCache()
    const res = await detail()
    expect(res.body.outlook.source).toBe('page')
    expect(forecastCacheStats()).toMatchObject({ misses: 1, hits: 0 })
    // The whole forecast on its route is the same simulation, kept: its 72 h chance is the page's.
    const whole = await request(t.app).get(`/api/v1/strings/${stringId}/forecast`).set('Authorization', crew)
    expect(forecastCacheStats()).toMatchObject({ misses: 1, hits: 1 })
    const at72 = whole.body.forecast.pDark.find((d: { hours: number }) => d.hours === 72)
    expect(res.body.outlook.pDark72).toBe(at72.p)
    await refreshForecasts(t.db, new Date())
    expect((await detail()).body.outlook.source).toBe('queue')
  })

  it('leaves a stored curve alone when it is missing, older than the last change or a day old', () => {
    const now = new Date('2026-12-03T18:00:00Z')
    const curve = JSON.stringify([
      [0, 0],
      [100, 0.5],
      [400, 1],
    ])
    const fresh = {
      forecastCurve: curve,
      forecastAt: '2026-12-03T12:00:00Z',
      forecastDarkAt: '2026-12-07T16:00:00Z',
      exposureAt: '2026-12-03T11:00:00Z',
    }
    // A fresh curve gives a chance and the likely dark day in the client's zone.
    const ok = storedOutlook(fresh, 7, 'Europe/London', now)
    expect(ok).toMatchObject({ source: 'queue', darkDate: '2026-12-07' })
    expect(ok!.pDark72).toBeGreaterThan(0)
    expect(storedOutlook({ ...fresh, forecastCurve: null }, 7, 'Europe/London', now)).toBeNull()
    expect(
      storedOutlook({ ...fresh, exposureAt: '2026-12-03T13:00:00Z' }, 7, 'Europe/London', now),
    ).toBeNull()
    expect(
      storedOutlook({ ...fresh, forecastAt: '2026-12-02T12:00:00Z' }, 7, 'Europe/London', now),
    ).toBeNull()
  })
})
