// Runs, forecasts and "today" in local time (Europe/London), with the app's clock faked through
// deps.now (a test hook, not a request parameter).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { createAccount, tokenFor } from './account-helpers'
import { refreshForecasts } from '../../server/jobs/refresh-forecasts'
import { localClock, localDay } from '../../shared/local-time'
import { listRuns } from '../../server/services/run-list'
import { runMail } from '../../server/mail/run-mail'

let t: TestApp
let crewId: number
let token: string
const runIds: Record<string, number> = {}
// Dates far from the demo's own runs; the first is in winter (GMT = UTC), the second the night the
// clocks go back (BST ends 2026-10-25 01:00 UTC — UK Summer Time Order 2002; timeanddate.com).
const DATES = ['2026-12-09', '2026-12-10', '2026-10-24', '2026-10-25']

beforeAll(async () => {
  t = await makeTestApp({ APP_TIME_ZONE: 'Europe/London' })
  ;[crewId] = await t.db('crews').insert({
    name: `Night ${randomUUID().slice(0, 6)}`,
    depotName: 'Test depot',
    depotLat: 51.5,
    depotLng: -0.1,
    shiftStart: '16:00',
    shiftEnd: '00:30',
  })
  const member = await createAccount(t, 'crew')
  await t.db('users').where({ id: member.id }).update({ crewId })
  token = `Bearer ${await tokenFor(t, member)}`
  for (const runDate of DATES) {
    const [id] = await t
      .db('runs')
      .insert({ crewId, runDate, state: 'published', version: 1, publishedAt: new Date() })
    runIds[runDate] = id
  }
})
afterAll(async () => {
  t.deps.now = undefined
  await t.db('runs').where({ crewId }).delete()
  await t.db('users').where({ crewId }).update({ crewId: null })
  await t.db('crews').where({ id: crewId }).delete()
  await t.close()
})

async function mineAt(instant: string) {
  t.deps.now = () => new Date(instant)
  const res = await request(t.app).get('/api/v1/runs/mine').set('Authorization', token)
  expect(res.status).toBe(200)
  return res.body as { date: string; run: { id: number } | null }
}

describe('GET /runs/mine on a 16:00–00:30 shift in Europe/London', () => {
  it('returns the same run at 23:50 and at 00:20 (winter: local = UTC)', async () => {
    const before = await mineAt('2026-12-09T23:50:00Z')
    const after = await mineAt('2026-12-10T00:20:00Z')
    expect(before.date).toBe('2026-12-09')
    expect(after.date).toBe('2026-12-09')
    expect(before.run?.id).toBe(runIds['2026-12-09'])
    expect(after.run?.id).toBe(runIds['2026-12-09'])
  })
  it('moves to the next day’s run once the shift has ended', async () => {
    const next = await mineAt('2026-12-10T00:40:00Z')
    expect(next.date).toBe('2026-12-10')
    expect(next.run?.id).toBe(runIds['2026-12-10'])
  })
  it('keeps one run through the night the clocks go back', async () => {
    // 23:50 BST on 24 Oct = 22:50 UTC; 00:20 BST on 25 Oct = 23:20 UTC on 24 Oct.
    expect((await mineAt('2026-10-24T22:50:00Z')).run?.id).toBe(runIds['2026-10-24'])
    expect((await mineAt('2026-10-24T23:20:00Z')).run?.id).toBe(runIds['2026-10-24'])
    // 18:00 GMT on 25 Oct: that evening's run.
    expect((await mineAt('2026-10-25T18:00:00Z')).run?.id).toBe(runIds['2026-10-25'])
  })
  it('still answers the run of an explicit date', async () => {
    t.deps.now = () => new Date('2026-12-10T00:20:00Z')
    const res = await request(t.app).get('/api/v1/runs/mine?date=2026-12-10').set('Authorization', token)
    expect(res.body.run.id).toBe(runIds['2026-12-10'])
  })
})

describe('forecast dates across the October change', () => {
  it('stores each forecast at the client’s local switch-on time, in summer and in winter time', async () => {
    // Forecast from 1 Oct 2026: dates before 25 Oct are in BST (UTC+1), later ones in GMT.
    await refreshForecasts(t.db, new Date('2026-10-01T12:00:00Z'))
    const rows = await t
      .db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .join('clients as c', 'c.id', 'si.clientId')
      .whereNotNull('s.forecastDarkAt')
      .select('s.forecastDarkAt', 'c.switchOn')
    expect(rows.length).toBeGreaterThan(0)
    for (const r of rows) expect(localClock(r.forecastDarkAt, 'Europe/London')).toBe(r.switchOn)
    const days = rows.map((r) => localDay(r.forecastDarkAt, 'Europe/London'))
    expect(days.some((d) => d < '2026-10-25')).toBe(true)
    // Back to forecasts from the real today for the other tests.
    await refreshForecasts(t.db)
  })
})

describe('run e-mail in the app locale', () => {
  it('names the day in words and says a shift ends after midnight', async () => {
    const [run] = await listRuns(t.db, '2026-12-09', crewId)
    const mail = runMail(t.deps.config, { name: 'Test', email: 'test@example.org' }, run, false)
    // 9 Dec 2026 is a Wednesday (ISO 8601 calendar, worked by hand from 2 Dec 2026 = Wed); en-GB day-first.
    expect(mail.subject).toMatch(/run for Wed,? 9 Dec 2026/)
    expect(mail.text).toContain('16:00–00:30 (ends after midnight)')
    expect(mail.subject).not.toContain('12/09/2026')
  })
})
