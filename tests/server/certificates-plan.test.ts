// The planner refuses what its certificates do not cover (issue 12 part 3): a platform whose thorough
// examination has expired (LOLER 1998 Schedule 1: at least every 6 months, trade-reference §7) keeps
// its work off the run with the reason named, on planning and again on publishing; a string hung on
// a column without a structural approval (BS EN 40 practice, trade-reference §7) stays off too.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let sup: string
const tag = `CP${Date.now().toString(36).toUpperCase()}`
const ids: Record<string, number> = {}
const date = new Date().toISOString().slice(0, 10)
const HOUR = 3_600_000

beforeAll(async () => {
  t = await makeTestApp()
  sup = `Bearer ${await t.token('supervisor')}`
  const [clientId] = await t.db('clients').insert({ name: `${tag} client`, kind: 'venue' })
  const [siteId] = await t
    .db('sites')
    .insert({ clientId, name: `${tag} yard`, kind: 'square', lat: 51.5, lng: -1.5 })
  const typeId = (await t.db('stringTypes').orderBy('id').first('id')).id
  ;[ids.column] = await t
    .db('structures')
    .insert({ siteId, kind: 'column', ref: `${tag}-COL`, lat: 51.5, lng: -1.5 })
  const string = (suffix: string, o: object) =>
    t.db('strings').insert({
      assetTag: `${tag}-${suffix}`,
      name: `${tag} ${suffix}`,
      typeId,
      siteId,
      lat: 51.5,
      lng: -1.5,
      ...o,
    })
  ;[ids.onColumn] = await string('ON-COL', { structureId: ids.column })
  ;[ids.line] = await string('LINE', { geometry: 'line' })
  const item = async (stringId: number, key: string) =>
    (
      await t.db('queueItems').insert({
        kind: 'dark',
        openKey: `dark:${tag}-${key}`,
        stringId,
        siteId,
        clientId,
        severity: 'standard',
        state: 'open',
        openedAt: new Date(),
        dueBy: new Date(Date.now() + 36 * HOUR),
        summary: `${tag} ${key}`,
      })
    )[0]
  ids.columnItem = await item(ids.onColumn, 'col')
  ids.lineItem = await item(ids.line, 'line')
  ;[ids.platform] = await t.db('platforms').insert({
    assetTag: `${tag}-P`,
    name: 'Boom lift fixture',
    kind: 'boom',
    workingHeightM: 16,
    safeWorkingLoadKg: 230,
  })
  // Examined 3 May 2026, due again 3 Nov 2026: expired before any run date this test uses (today or later).
  await t.db('certificates').insert({
    kind: 'platform_exam',
    subjectType: 'platform',
    subjectId: ids.platform,
    doneOn: '2026-05-03',
    nextDue: '2026-11-03',
    result: 'pass',
  })
  ;[ids.crew] = await t.db('crews').insert({
    name: `${tag} crew`,
    depotName: `${tag} depot`,
    depotLat: 51.5,
    depotLng: -1.5,
    shiftStart: '00:00',
    shiftEnd: '23:59',
    platformId: ids.platform,
  })
})
afterAll(async () => {
  await t.db('runs').where({ crewId: ids.crew }).delete()
  await t.db('crews').where({ id: ids.crew }).delete()
  await t.db('queueItems').whereIn('id', [ids.columnItem, ids.lineItem]).delete()
  await t.close()
})

const plan = (itemIds: number[]) =>
  request(t.app)
    .post('/api/v1/runs/plan')
    .set('Authorization', sup)
    .send({ date, crewIds: [ids.crew], itemIds })
type Unassigned = { itemId: number; reason: string; message: string }
const stopsOf = (body: { runs: { stops: { itemId: number }[] }[] }) =>
  body.runs.flatMap((r) => r.stops.map((s) => s.itemId))

describe('the planner and certificates', () => {
  it('keeps work needing an expired platform off the run and names the platform and date', async () => {
    const res = await plan([ids.lineItem])
    expect(res.status).toBe(200)
    expect(stopsOf(res.body)).not.toContain(ids.lineItem)
    const u = res.body.unassigned.find((x: Unassigned) => x.itemId === ids.lineItem)
    expect(u.reason).toBe('platform_not_examined')
    // 3 Nov 2026 by hand: 2 Dec 2026 is a Wednesday, 29 days earlier is a Tuesday.
    expect(u.message).toContain(
      `Platform ${tag}-P (Boom lift fixture, crew ${tag} crew): thorough examination expired Tue, 3 Nov 2026.`,
    )
  })

  it('re-checks on publishing: the refused item is not saved on the run', async () => {
    const res = await request(t.app)
      .post('/api/v1/runs/publish')
      .set('Authorization', sup)
      .send({ date, runs: [{ crewId: ids.crew, itemIds: [ids.lineItem] }] })
    expect(res.status).toBe(200)
    expect(res.body.unassigned.map((u: Unassigned) => u.reason)).toContain('platform_not_examined')
    const run = await t.db('runs').where({ crewId: ids.crew, runDate: date }).first('id')
    expect(
      await t.db('runStops').where({ runId: run.id, queueItemId: ids.lineItem }).count({ n: '*' }),
    ).toEqual([{ n: 0 }])
  })

  it('keeps a string on a column without a structural approval off the run, and plans it once approved', async () => {
    const res = await plan([ids.columnItem])
    const u = res.body.unassigned.find((x: Unassigned) => x.itemId === ids.columnItem)
    expect(u.reason).toBe('structure_not_approved')
    expect(u.message).toBe(
      `Hung on column ${tag}-COL, which has no valid structural approval: no column structural test on record.`,
    )
    const safety = `Bearer ${await t.token('safety')}`
    const approved = await request(t.app).post('/api/v1/certificates').set('Authorization', safety).send({
      kind: 'column_structural',
      subjectType: 'structure',
      subjectId: ids.column,
      doneOn: date,
      nextDue: '2031-12-01',
      result: 'pass',
    })
    expect(approved.status).toBe(201)
    const again = await plan([ids.columnItem])
    expect(again.body.unassigned.map((x: Unassigned) => x.reason)).not.toContain('structure_not_approved')
    expect(stopsOf(again.body)).toContain(ids.columnItem)
  })

  it('plans the platform work again once a new examination passes', async () => {
    const safety = `Bearer ${await t.token('safety')}`
    const exam = await request(t.app).post('/api/v1/certificates').set('Authorization', safety).send({
      kind: 'platform_exam',
      subjectType: 'platform',
      subjectId: ids.platform,
      doneOn: date,
      nextDue: '2027-05-01',
      result: 'pass',
    })
    expect(exam.status).toBe(201)
    const res = await plan([ids.lineItem])
    expect(stopsOf(res.body)).toContain(ids.lineItem)
  })
})
