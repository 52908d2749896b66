// Certificates drive work (issue 12 part 3): a failed test opens a queue item in the same request and
// reads "fail", a later pass settles it; the first certificate for any subject; the subject search;
// the safety officer's queue; the certificate's document, checked by its bytes and kept from crews.
// Limits: BS 7671:2018 Table 64 (insulation, ≥ 1.0 MΩ for circuits up to 500 V) and BS EN 61008-1 /
// BS 7671 reg 415.1.1 (a 30 mA general RCD trips within 40 ms at 5 × IΔn), trade-reference §5.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let safety: string
const tag = `CW${Date.now().toString(36).toUpperCase()}`
const ids: Record<string, number> = {}
const today = new Date().toISOString().slice(0, 10)

beforeAll(async () => {
  t = await makeTestApp()
  safety = `Bearer ${await t.token('safety')}`
  const supplyPointId = (await t.db('supplyPoints').orderBy('id').first('id')).id
  const circuit = { supplyPointId, supplyVolts: 230, breakerAmps: 16, breakerCurve: 'B', rcdMa: 30 }
  ;[ids.ir] = await t.db('circuits').insert({ ...circuit, ref: `${tag}-IR` })
  ;[ids.rcd] = await t.db('circuits').insert({ ...circuit, ref: `${tag}-RCD` })
  ;[ids.platform] = await t.db('platforms').insert({
    assetTag: `${tag}-P`,
    name: 'Scissor lift fixture',
    kind: 'scissor',
    workingHeightM: 10,
    safeWorkingLoadKg: 200,
  })
})
afterAll(async () => {
  const circuits = [ids.ir, ids.rcd].filter(Boolean)
  await t
    .db('queueItems')
    .whereIn(
      'certificateId',
      t.db('certificates').whereIn('subjectId', circuits).where({ subjectType: 'circuit' }).select('id'),
    )
    .delete()
  await t.db('certificates').whereIn('subjectId', circuits).where({ subjectType: 'circuit' }).delete()
  await t.db('circuits').whereIn('id', circuits).delete()
  await t.close()
})

const record = (body: object) =>
  request(t.app)
    .post('/api/v1/certificates')
    .set('Authorization', safety)
    .send({ doneOn: today, ...body })
const itemsOf = (certificateId: number) =>
  t.db('queueItems').where({ certificateId }).select('kind', 'state', 'severity', 'summary')

describe('a failed test opens work at once', () => {
  it('a failed insulation test reads fail, opens an emergency item in the same request, and a pass settles it', async () => {
    // 0.5 MΩ at 500 V DC on a 230 V circuit: below the 1.0 MΩ minimum of BS 7671 Table 64.
    const res = await record({
      kind: 'insulation_test',
      subjectType: 'circuit',
      subjectId: ids.ir,
      nextDue: '2027-12-01',
      readings: { testVolts: 500, megohms: 0.5 },
    })
    expect(res.status).toBe(201)
    expect(res.body.result).toBe('fail')
    const items = await itemsOf(res.body.id)
    expect(items).toHaveLength(1)
    expect(items[0]).toMatchObject({ kind: 'certificate_due', state: 'open', severity: 'emergency' })
    expect(items[0].summary).toContain('Failed: Insulation resistance test')
    const failed = await request(t.app)
      .get('/api/v1/certificates?due=failed&kind=insulation_test')
      .set('Authorization', safety)
    expect(failed.body.items.find((c: { id: number }) => c.id === res.body.id)?.result).toBe('fail')
    // 50 MΩ: well above 1.0 MΩ (Table 64): a pass, and the failed item closes in the same request.
    const pass = await record({
      kind: 'insulation_test',
      subjectType: 'circuit',
      subjectId: ids.ir,
      nextDue: '2027-12-01',
      readings: { testVolts: 500, megohms: 50 },
    })
    expect(pass.body.result).toBe('pass')
    expect((await itemsOf(res.body.id))[0].state).toBe('closed')
  })

  it('a failing RCD (52 ms at 5 × IΔn, limit 40 ms) opens an RCD item in the same request', async () => {
    const res = await record({
      kind: 'rcd_test',
      subjectType: 'circuit',
      subjectId: ids.rcd,
      nextDue: '2027-06-01',
      readings: { ratedMa: 30, noTripAtHalf: true, tripMsAt1x: 24, tripMsAt5x: 52 },
    })
    expect(res.status).toBe(201)
    expect(res.body.result).toBe('fail')
    const items = await itemsOf(res.body.id)
    expect(items).toMatchObject([{ kind: 'rcd_failed', state: 'open', severity: 'emergency' }])
  })

  it('a failed platform examination opens a standard item (no electrical hazard of its own)', async () => {
    const res = await record({
      kind: 'platform_exam',
      subjectType: 'platform',
      subjectId: ids.platform,
      result: 'fail',
    })
    expect(res.status).toBe(201)
    expect(await itemsOf(res.body.id)).toMatchObject([
      { kind: 'certificate_due', state: 'open', severity: 'standard' },
    ])
  })
})

describe('the first certificate for a subject', () => {
  it('finds the subject by its tag and records its first certificate', async () => {
    const found = await request(t.app)
      .get(`/api/v1/certificates/subjects?q=${tag}-RCD`)
      .set('Authorization', safety)
    expect(found.status).toBe(200)
    expect(found.body.items).toEqual([
      { subjectType: 'circuit', subjectId: ids.rcd, label: `Circuit ${tag}-RCD` },
    ])
    const platform = await request(t.app)
      .get(`/api/v1/certificates/subjects?q=${tag}-P&subjectType=platform`)
      .set('Authorization', safety)
    expect(platform.body.items).toEqual([
      { subjectType: 'platform', subjectId: ids.platform, label: `${tag}-P Scissor lift fixture` },
    ])
  })

  it('refuses a kind that does not fit the subject with 400 kind_not_for_subject', async () => {
    const res = await record({
      kind: 'rcd_test',
      subjectType: 'platform',
      subjectId: ids.platform,
      result: 'pass',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('kind_not_for_subject')
  })
})

describe("the safety officer's queue", () => {
  it('shows certificate work only and refuses other kinds with 403', async () => {
    const res = await request(t.app).get('/api/v1/queue').set('Authorization', safety)
    expect(res.status).toBe(200)
    const kinds = new Set(res.body.items.map((i: { kind: string }) => i.kind))
    expect([...kinds].every((k) => k === 'certificate_due' || k === 'rcd_failed')).toBe(true)
    expect(kinds.has('rcd_failed')).toBe(true)
    const dark = await request(t.app).get('/api/v1/queue?kind=dark').set('Authorization', safety)
    expect(dark.status).toBe(403)
    const crew = await request(t.app)
      .get('/api/v1/queue')
      .set('Authorization', `Bearer ${await t.token('crew')}`)
    expect(crew.status).toBe(403)
  })
})
