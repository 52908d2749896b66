import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let manager: string
beforeAll(async () => {
  t = await makeTestApp()
  manager = `Bearer ${await t.token('manager')}`
})
afterAll(() => t.close())

describe('energy', () => {
  it('prices each client’s season: watts × burning hours a night × season days × tariff', async () => {
    const res = await request(t.app).get('/api/v1/energy').set('Authorization', manager)
    expect(res.status).toBe(200)
    const town = res.body.clients.find((c: { name: string }) => c.name === 'Wrenfold Town Council')
    expect(town.burnHoursPerDay).toBe(7) // the demo contract switches 16:00–23:00
    expect(town.kwhPerNight).toBeCloseTo((town.watts * 7) / 1000, 6)
    expect(town.kwhPerSeason).toBeCloseTo(town.kwhPerNight * town.seasonDays, 6)
    expect(town.costPerSeason).toBeCloseTo(town.kwhPerSeason * town.tariffPerKwh, 6)
    const siteWatts = town.sites.reduce((s: number, x: { watts: number }) => s + x.watts, 0)
    expect(siteWatts).toBeCloseTo(town.watts, 6)
    // A 20-lamp 12 V 0.5 A catenary runs near its 120 W rating on 230 V (r = 230/240, power ∝ r^1.6:
    // Fink & Beaty via Wikipedia "Lamp rerating"), so the catenaries dominate the town's load.
    expect(town.types[0].code).toBe('CAT-F20')
  })
})

// The register's paging, filters, import and export: tests/server/register*.test.ts.

describe('client report', () => {
  it('counts the season’s visits and relamps under isolation for a client, and faults against contract time', async () => {
    const client = await t.db('clients').where({ name: 'Wrenfold Town Council' }).first('id')
    const res = await request(t.app)
      .get(`/api/v1/client-report?clientId=${client.id}`)
      .set('Authorization', manager)
    expect(res.status).toBe(200)
    const visits = await t
      .db('visits as v')
      .join('strings as s', 's.id', 'v.stringId')
      .join('sites as si', 'si.id', 's.siteId')
      .where('si.clientId', client.id)
      .where('v.visitedAt', '>=', `${res.body.from} 00:00:00`)
      .count({ n: '*' })
    expect(res.body.visits.total).toBe(Number(visits[0].n))
    expect(res.body.visits.relampsIsolated).toBeLessThanOrEqual(res.body.visits.relamps)
    expect(res.body.faults.closedOnTime).toBeLessThanOrEqual(res.body.faults.closed)
    expect(res.body.strings.total).toBe(
      Object.values(res.body.strings.byStatus as Record<string, number>).reduce((a, b) => a + b, 0),
    )
    expect(res.body.client.standardHours).toBe(36)
  })
})
