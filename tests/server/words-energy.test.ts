import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

// A tiny display of our own: two healthy filament strings and one isolated one, priced for a short
// season, then re-lamped on an LED type. Every expected figure is worked out by hand below.
let t: TestApp
let manager: string
const ids = { client: 0, site: 0, filament: 0, led: 0, strings: [] as number[] }
const TAG = 'WORDS-EN'

async function addType(code: string, row: Record<string, unknown>, cls: Record<string, unknown>) {
  const [id] = await t
    .db('stringTypes')
    .insert({ code, name: `Words test ${code}`, ratedLifeHours: 1000, ...row })
  await t.db('lampClasses').insert({ stringTypeId: id, position: 0, label: 'Lamp', ...cls })
  return id as number
}

beforeAll(async () => {
  t = await makeTestApp()
  manager = `Bearer ${await t.token('manager')}`
  ;[ids.client] = await t.db('clients').insert({
    name: 'Words test client',
    kind: 'venue',
    switchOn: '16:00',
    switchOff: '22:00', // 6 burning hours a night
    seasonStart: '2026-12-01',
    seasonEnd: '2026-12-10', // 10 nights, both ends counted
    tariffPerKwh: 0.3,
  })
  ;[ids.site] = await t
    .db('sites')
    .insert({ clientId: ids.client, name: 'Words yard', kind: 'venue', lat: 54, lng: -2 })
  // 20 lamps of 12 V 0.5 A on 240 V: exactly at rating, so 240 V × 0.5 A = 120 W (no law needed).
  ids.filament = await addType(
    `${TAG}-F`,
    { technology: 'filament', wiring: 'series', supplyVolts: 240 },
    { count: 20, ratedVolts: 12, ratedAmps: 0.5, shunted: true },
  )
  // 10 LED modules of 230 V 0.01 A in parallel: 230 V × 0.1 A = 23 VA; at power factor 0.9, 20.7 W.
  ids.led = await addType(
    `${TAG}-L`,
    { technology: 'led', wiring: 'parallel', supplyVolts: 230, shuntFailProbability: 0, powerFactor: 0.9 },
    { count: 10, ratedVolts: 230, ratedAmps: 0.01, shunted: false },
  )
  for (const [n, isolated] of [
    [1, false],
    [2, false],
    [3, true],
  ] as const) {
    const [id] = await t.db('strings').insert({
      assetTag: `${TAG}-${n}`,
      name: `Words string ${n}`,
      typeId: ids.filament,
      siteId: ids.site,
      lat: 54,
      lng: -2,
      isolated,
      status: isolated ? 'safe' : 'lit',
    })
    ids.strings.push(id)
  }
})
afterAll(async () => {
  await t.db('strings').whereIn('id', ids.strings).delete()
  await t.db('sites').where({ id: ids.site }).delete()
  await t.db('clients').where({ id: ids.client }).delete()
  await t.db('stringTypes').whereIn('id', [ids.filament, ids.led]).delete()
  await t.close()
})

const whatIf = (q: string, auth = manager) =>
  request(t.app).get(`/api/v1/energy/led-what-if?${q}`).set('Authorization', auth)

describe('GET /energy/led-what-if', () => {
  it('prices the filament strings today and re-lamped on the LED type, a season side by side', async () => {
    const res = await whatIf(`clientId=${ids.client}&typeId=${ids.led}`)
    expect(res.status).toBe(200)
    expect(res.body.burnHoursPerDay).toBe(6) // 16:00–22:00
    expect(res.body.seasonDays).toBe(10) // 1–10 December
    expect(res.body.strings).toBe(3)
    expect(res.body.isolated).toBe(1)
    // Today: 2 lit strings × 120 W = 240 W (the isolated one is off). Hand arithmetic:
    // 240 W × 6 h = 1.44 kWh a night; × 10 nights = 14.4 kWh; × £0.30 = £4.32.
    expect(res.body.today.watts).toBeCloseTo(240, 6)
    expect(res.body.today.kwhPerNight).toBeCloseTo(1.44, 6)
    expect(res.body.today.kwhPerSeason).toBeCloseTo(14.4, 6)
    expect(res.body.today.costPerSeason).toBeCloseTo(4.32, 6)
    // Re-lamped: one LED string for each lit one: 230 V × 10 × 0.01 A = 23 VA, × power factor 0.9 =
    // 20.7 W (energy is billed on watts, not volt-amps). 2 × 20.7 = 41.4 W; × 6 h = 0.2484 kWh a night;
    // × 10 nights = 2.484 kWh; × £0.30 = £0.7452.
    expect(res.body.type).toMatchObject({ id: ids.led, code: `${TAG}-L` })
    expect(res.body.type.voltAmps).toBeCloseTo(23, 6)
    expect(res.body.type.watts).toBeCloseTo(20.7, 6)
    expect(res.body.relamped.watts).toBeCloseTo(41.4, 6)
    expect(res.body.relamped.kwhPerNight).toBeCloseTo(0.2484, 6)
    expect(res.body.relamped.kwhPerSeason).toBeCloseTo(2.484, 6)
    expect(res.body.relamped.costPerSeason).toBeCloseTo(0.7452, 6)
    expect(res.body.byType).toHaveLength(1)
    expect(res.body.byType[0]).toMatchObject({ code: `${TAG}-F`, strings: 3 })
    expect(res.body.ledTypes.map((x: { id: number }) => x.id)).toContain(ids.led)
  })

  it('refuses a filament type as the LED choice and an unknown client', async () => {
    const notLed = await whatIf(`clientId=${ids.client}&typeId=${ids.filament}`)
    expect(notLed.status).toBe(400)
    expect(notLed.body.error.code).toBe('not_led_type')
    const missing = await whatIf(`clientId=999999&typeId=${ids.led}`)
    expect(missing.status).toBe(404)
    const bad = await whatIf('clientId=abc')
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('validation_failed')
  })

  it('is open to the energy page’s roles only', async () => {
    const crew = await whatIf(`clientId=${ids.client}`, `Bearer ${await t.token('crew')}`)
    expect(crew.status).toBe(403)
    const sup = await whatIf(`clientId=${ids.client}`, `Bearer ${await t.token('supervisor')}`)
    expect(sup.status).toBe(200)
  })
})
