// Replace now by risk (issue 11 part 5): the forecast job flags a string whose chance of going dark
// before anyone is due to pass is over its type's setting (default 20 %), says which rule fired, and
// clears the flag when the risk has gone.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { makeFixture, makeString, type Fixture } from './engine-fixtures'
import { refreshQueue } from '../../server/jobs/refresh-queue'
import { isoDay } from '../../shared/iso-time'

let t: TestApp
let f: Fixture
let sup: string
const tag = `R${Date.now().toString(36).toUpperCase()}`
const ids: Record<string, number> = {}
beforeAll(async () => {
  t = await makeTestApp()
  f = await makeFixture(t.db, tag)
  sup = `Bearer ${await t.token('supervisor')}`
  const now = new Date()
  const worn = { lampAgeHours: 10000, lampExposure: JSON.stringify([10000, 10000]), exposureAt: now }
  const fresh = { lampAgeHours: 0, lampExposure: JSON.stringify([0, 0]), exposureAt: now }
  ids.worn = await makeString(t.db, f, tag, worn)
  ids.fresh = await makeString(t.db, f, tag, fresh)
  ids.cleared = await makeString(t.db, f, tag, {
    ...fresh,
    status: 'replace',
    replaceNow: true,
    replaceRule: 'risk',
    riskNote: 'forecast: 30 % chance of going dark within the 36 h response time',
  })
  ids.patrolled = await makeString(t.db, f, tag, worn)
  // A published run two days ahead holds a stop for it: its next planned patrol.
  const crew = await t.db('crews').first('id')
  const runDate = isoDay(now.getTime() + 2 * 86_400_000)
  await t.db('runs').where({ crewId: crew.id, runDate }).delete()
  const [runId] = await t.db('runs').insert({ crewId: crew.id, runDate, state: 'published', version: 1 })
  await t.db('runStops').insert({ runId, position: 1, stringId: ids.patrolled })
  ids.runDay = Number(runDate.slice(8))
  await refreshQueue(t.db, now)
})
afterAll(() => t.close())

const str = (id: number) =>
  t.db('strings').where({ id }).first('status', 'replaceNow', 'replaceRule', 'riskNote')
const openReplaceItem = (id: number) =>
  t.db('queueItems').where({ stringId: id, kind: 'replace_now', state: 'open' }).first('id', 'summary')

// Hand bound for the worn string (Weibull life, LRC NLPIP: rated life is the median; shape 2.8):
// η = 1000 h / (ln 2)^(1/2.8) = 1000 / 0.877308 = 1139.85 h. Lamps and fuse lamp at r = 240 / 240 = 1,
// so exposure grows one hour per burning hour. Response time 36 h × 7 burning h / 24 h = 10.5 h.
// The fuse lamp alone fails within it with probability 1 − exp(−[(10010.5/η)^2.8 − (10000/η)^2.8])
// = 1 − exp(−(438.633 − 437.346)) = 1 − exp(−1.287) = 0.724; any other failure only raises its voltage,
// so P(dark) ≥ 0.72, far over the 20 % setting. The fresh string: 20 × (1 − exp(−(10.5/η)^2.8)) ≈ 4e−5.
describe('the risk rule', () => {
  it('flags a worn string over the setting as replace now, rule risk, and opens its item in words', async () => {
    const s = await str(ids.worn)
    expect(s).toMatchObject({ status: 'replace', replaceNow: 1, replaceRule: 'risk' })
    const p = Number(/(\d+) % chance/.exec(s.riskNote)?.[1])
    expect(p).toBeGreaterThanOrEqual(60) // ≥ 72 % by hand, less three standard errors of 400 trials
    const item = await openReplaceItem(ids.worn)
    expect(item.summary).toMatch(
      /replace now, forecast: \d+ % chance of going dark within the 36 h response time$/,
    )
    // The queue's reasons word the rule that fired.
    const list = await request(t.app).get('/api/v1/queue?kind=replace_now').set('Authorization', sup)
    const listed = list.body.items.find((i: { id: number }) => i.id === item.id)
    expect(listed.why[0]).toMatch(/^Forecast: \d+ % chance of going dark/)
    // The string page's reasons say so too.
    const page = await request(t.app).get(`/api/v1/strings/${ids.worn}`).set('Authorization', sup)
    expect(page.body.replaceRule).toBe('risk')
    const codes = (page.body.assessment.reasons as { code: string }[]).map((r) => r.code)
    expect(codes).toContain('replace_risk')
  })

  it('judges against the next planned patrol when one is published', async () => {
    const s = await str(ids.patrolled)
    expect(s.replaceRule).toBe('risk')
    expect(s.riskNote).toMatch(new RegExp(`before the next patrol on ${ids.runDay} [A-Z][a-z]+$`))
  })

  it('leaves a fresh string lit, and clears a risk flag once the risk has gone', async () => {
    expect(await str(ids.fresh)).toMatchObject({ status: 'lit', replaceNow: 0, replaceRule: null })
    expect(await str(ids.cleared)).toMatchObject({
      status: 'lit',
      replaceNow: 0,
      replaceRule: null,
      riskNote: null,
    })
    expect(await openReplaceItem(ids.cleared)).toBeUndefined()
  })

  it('keeps the ratio rule as it was: a string over its ratio says ratio', async () => {
    // 2 of 20 shorted: r = 240 / 216 = 1.111 ≥ 1.05 (trade-reference §2–3).
    const res = await request(t.app)
      .post('/api/v1/visits')
      .set('Authorization', `Bearer ${await t.token('crew')}`)
      .set('Idempotency-Key', crypto.randomUUID())
      .send({ stringId: ids.fresh, failedFound: 2, replaced: 0 })
    expect(res.status).toBe(201)
    expect(await str(ids.fresh)).toMatchObject({ status: 'replace', replaceRule: 'ratio' })
    expect((await openReplaceItem(ids.fresh)).summary).toMatch(/2 lamps out, replace now$/)
  })
})
