// The string's whole forecast (GET /strings/{id}/forecast, under the page's "How this is worked out")
// is kept per process by the engine's input (issue 13 part 7): reading an unchanged string again runs no
// second simulation; a visit changes the string's state, so its key.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import {
  clearForecastCache,
  forecastCacheStats,
  forecastKey,
  settledRequest,
} from '../../server/services/forecast-cache'
import type { ForecastRequest } from '../../shared/schemas/engine-forecast'

let t: TestApp
let crew: string
let stringId: number
beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
  // A lit 20-lamp filament catenary (19 shunted + fuse lamp) from the demo town, as visits.test.ts uses.
  const s = await t
    .db('strings as s')
    .join('stringTypes as ty', 'ty.id', 's.typeId')
    .where({ 'ty.code': 'CAT-F20', 's.status': 'lit' })
    .orderBy('s.id', 'desc')
    .first('s.id')
  stringId = s.id
})
afterAll(() => t.close())

const forecastOf = (id: number) =>
  request(t.app).get(`/api/v1/strings/${id}/forecast`).set('Authorization', crew)

describe('the forecast cache', () => {
  it('simulates an unchanged string once, and again after a visit changes it', async () => {
    clearForecastCache()
    const first = await forecastOf(stringId)
    expect(first.status).toBe(200)
    const before = await t.db('strings').where({ id: stringId }).first('lampsOut')
    expect(forecastCacheStats()).toMatchObject({ misses: 1, hits: 0 })
    const second = await forecastOf(stringId)
    expect(forecastCacheStats()).toMatchObject({ misses: 1, hits: 1 })
    expect(second.body.forecast).toEqual(first.body.forecast)

    const visit = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', crew)
      .set('Idempotency-Key', randomUUID())
      .send({ stringId, failedFound: 1, replaced: 0, notes: 'One out by the bank.' })
    expect(visit.status).toBe(201)
    const third = await forecastOf(stringId)
    expect(third.status).toBe(200)
    const after = await t.db('strings').where({ id: stringId }).first('lampsOut')
    expect(after.lampsOut).toBe(before.lampsOut + 1)
    // A new state is a new key: simulated again, not the old answer.
    expect(forecastCacheStats()).toMatchObject({ misses: 2, hits: 1 })
  })

  it('gives two strings in the same state one simulation and the same forecast', async () => {
    // Another string of the type made the same as this one in every forecast input (condition, lamp
    // ages, site and so schedule) and so in its state too; only its id, tag and place differ.
    const s = await t.db('strings').where({ id: stringId }).first()
    const other = await t
      .db('strings')
      .where({ typeId: s.typeId })
      .whereNot({ id: stringId })
      .orderBy('id')
      .first('id')
    const same = [
      'siteId',
      'lampsOut',
      'fuseFailed',
      'dark',
      'isolated',
      'lampAgeHours',
      'status',
      'replaceNow',
      'replaceRule',
      'riskNote',
      'maxRatio',
    ]
    await t
      .db('strings')
      .where({ id: other.id })
      .update({
        ...Object.fromEntries(same.map((k) => [k, s[k]])),
        lampExposure: s.lampExposure == null ? null : JSON.stringify(s.lampExposure),
        exposureAt: s.exposureAt,
      })
    clearForecastCache()
    const a = await forecastOf(stringId)
    const b = await forecastOf(other.id)
    expect(b.status).toBe(200)
    expect(forecastCacheStats()).toMatchObject({ misses: 1, hits: 1 })
    expect(b.body.forecast).toEqual(a.body.forecast)
  })

  it('keys lamp ages in whole burning hours: a few minutes of burning keep the key, an hour does not', () => {
    // A made-up request; only its shape matters here.
    const req = (age: number) =>
      ({
        supplyVolts: 230,
        lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.5, shunted: true, ageHours: age }],
        burnHoursPerDay: 15,
        startDate: '2026-12-02',
        trials: 2000,
        seed: 1,
      }) as unknown as ForecastRequest
    // 120.2 h and 120.4 h both round to 120 h; 121.0 h does not.
    expect(forecastKey(settledRequest(req(120.2)))).toBe(forecastKey(settledRequest(req(120.4))))
    expect(forecastKey(settledRequest(req(120.2)))).not.toBe(forecastKey(settledRequest(req(121))))
    expect(settledRequest(req(120.4)).lamps[0].ageHours).toBe(120)
  })
})
