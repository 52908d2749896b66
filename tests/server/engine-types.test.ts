// String-type data of the engine's second edition (issue 11): parallel chains, LED driver data, a
// reference measurement of a healthy string, the risk setting and each lamp class's own life model go
// through the estate API and back, and bad values are 400s that name the field.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let auth: string
beforeAll(async () => {
  t = await makeTestApp()
  auth = `Bearer ${await t.token('manager')}`
})
afterAll(() => t.close())

const run = Date.now().toString(36).toUpperCase()
// Values are invented for the round trip (typical data-sheet figures, demo); the bounds checked below
// are the schema's own.
const ledType = {
  code: `ETL-${run}`.slice(0, 30),
  name: 'Test LED curtain, two chains',
  technology: 'led',
  wiring: 'series',
  supplyVolts: 230,
  ratedLifeHours: 25000,
  branches: 2,
  powerFactor: 0.55,
  driverMinVolts: 180,
  driverMaxVolts: 264,
  inrushPeakAmps: 15,
  inrushMs: 1,
  replaceRisk: 0.25,
  lampClasses: [{ label: 'LED section', count: 10, ratedVolts: 23, ratedAmps: 0.02, shunted: false }],
}
const filamentType = {
  code: `ETF-${run}`.slice(0, 30),
  name: 'Test catenary with reference',
  technology: 'filament',
  supplyVolts: 230,
  ratedLifeHours: 1500,
  referenceColdOhms: 42.7,
  referenceHotAmps: 0.4896,
  referenceVolts: 230,
  hotColdRatio: 11,
  lampClasses: [
    { label: 'Lamp', count: 19, ratedVolts: 12, ratedAmps: 0.5, shunted: true },
    { label: 'Fuse lamp', count: 1, ratedVolts: 11, ratedAmps: 0.5, shunted: false, lifeExponent: 16 },
  ],
}

const post = (body: object) =>
  request(t.app).post('/api/v1/string-types').set('Authorization', auth).send(body)
const paths = (res: request.Response) =>
  (res.body.error?.details?.fields ?? []).map((f: { path: string }) => f.path) as string[]

describe('string-type data through the estate API', () => {
  it('stores and answers the LED driver data, chains and risk setting', async () => {
    const res = await post(ledType)
    expect(res.status).toBe(201)
    const { lampClasses, ...fields } = ledType
    expect(res.body).toMatchObject(fields)
    expect(res.body.lampClasses).toEqual([{ ...lampClasses[0], ratedLifeHours: null, lifeExponent: null }])
    const got = await request(t.app).get(`/api/v1/string-types/${res.body.id}`).set('Authorization', auth)
    expect(got.body).toMatchObject(fields)
  })

  it('stores the reference measurement and a fuse lamp class with its own life exponent', async () => {
    const res = await post(filamentType)
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      branches: 1, // the schema's default
      referenceColdOhms: 42.7,
      referenceHotAmps: 0.4896,
      referenceVolts: 230,
      hotColdRatio: 11,
      powerFactor: null,
      replaceRisk: null,
    })
    expect(res.body.lampClasses[1]).toMatchObject({ ratedVolts: 11, lifeExponent: 16, ratedLifeHours: null })
    // The settings list (every role) carries the same fields.
    const list = await request(t.app).get('/api/v1/string-types').set('Authorization', auth)
    const listed = list.body.items.find((x: { id: number }) => x.id === res.body.id)
    expect(listed).toMatchObject({ referenceColdOhms: 42.7, hotColdRatio: 11 })
    expect(listed.classes[1]).toMatchObject({ lifeExponent: 16, ratedLifeHours: null })
    // A PATCH changes one field and leaves the rest.
    const patched = await request(t.app)
      .patch(`/api/v1/string-types/${res.body.id}`)
      .set('Authorization', auth)
      .send({ version: 1, hotColdRatio: 12.5 })
    expect(patched.status).toBe(200)
    expect(patched.body).toMatchObject({ hotColdRatio: 12.5, referenceColdOhms: 42.7 })
  })

  it('refuses out-of-range values with 400 and the field', async () => {
    const bad: [object, string][] = [
      [{ powerFactor: 1.5 }, 'body.powerFactor'],
      [{ branches: 0 }, 'body.branches'],
      [{ replaceRisk: 1 }, 'body.replaceRisk'],
      [{ hotColdRatio: 0.5 }, 'body.hotColdRatio'],
      [{ inrushMs: 0 }, 'body.inrushMs'],
      [{ referenceColdOhms: -3 }, 'body.referenceColdOhms'],
    ]
    for (const [change, path] of bad) {
      const res = await post({ ...ledType, code: `X${path.length}-${run}`.slice(0, 30), ...change })
      expect(res.status, path).toBe(400)
      expect(res.body.error.code).toBe('validation_failed')
      expect(paths(res)).toContain(path)
    }
    const lamp = await post({
      ...filamentType,
      code: `XL-${run}`,
      lampClasses: [{ ...filamentType.lampClasses[1], lifeExponent: 50, ratedLifeHours: 10 }],
    })
    expect(lamp.status).toBe(400)
    expect(paths(lamp)).toEqual(
      expect.arrayContaining(['body.lampClasses.0.lifeExponent', 'body.lampClasses.0.ratedLifeHours']),
    )
  })

  it('refuses a driver range upside down and a hot reading without its volts', async () => {
    const range = await post({ ...ledType, code: `XR-${run}`, driverMinVolts: 264, driverMaxVolts: 180 })
    expect(range.status).toBe(400)
    expect(range.body.error.code).toBe('validation_failed')
    expect(paths(range)).toEqual(['body.driverMaxVolts'])
    const hot = await post({ ...filamentType, code: `XH-${run}`, referenceVolts: null })
    expect(hot.status).toBe(400)
    expect(paths(hot)).toEqual(['body.referenceVolts'])
  })
})
