// RCD types on circuits and certificates, insulation by the circuit's voltage (issue 11 part 8).
// Limits: BS EN 61008-1 / 61009-1 trip times, BS 7671 reg 415.1.1 additional protection, BS 7671:2018
// Table 64 insulation minimums (trade-reference §5).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let safety: string
let admin: string
const ids: Record<string, number> = {}
const run = Date.now().toString(36).toUpperCase()
const today = new Date().toISOString().slice(0, 10)

beforeAll(async () => {
  t = await makeTestApp()
  safety = `Bearer ${await t.token('safety')}`
  admin = `Bearer ${await t.token('admin')}`
  ids.supplyPoint = (await t.db('supplyPoints').orderBy('id').first('id')).id
})
afterAll(async () => {
  await t
    .db('certificates')
    .whereIn('subjectId', [ids.s, ids.general].filter(Boolean))
    .where({ subjectType: 'circuit' })
    .delete()
  await t
    .db('queueItems')
    .whereIn('openKey', [`rcd_failed:circuit-rcd:${ids.s}`])
    .delete()
  await t.db('circuits').whereIn('id', [ids.s, ids.general].filter(Boolean)).delete()
  await t.close()
})

const record = (body: object) =>
  request(t.app)
    .post('/api/v1/certificates')
    .set('Authorization', safety)
    .send({ subjectType: 'circuit', doneOn: today, ...body })

describe('RCD type on circuits', () => {
  it('has a type on every circuit after the migration, general by default', async () => {
    expect(await t.db('circuits').whereNull('rcdType').count({ n: '*' }).first()).toEqual({ n: 0 })
    const [id] = await t.db('circuits').insert({
      supplyPointId: ids.supplyPoint,
      ref: `PG-${run}`,
      supplyVolts: 230,
      breakerAmps: 16,
      breakerCurve: 'B',
      rcdMa: 30,
    })
    ids.general = id
    expect((await t.db('circuits').where({ id }).first('rcdType')).rcdType).toBe('general')
  })

  it('creates a circuit with a time-delayed RCD through the estate API and refuses an unknown type', async () => {
    const body = {
      supplyPointId: ids.supplyPoint,
      ref: `PS-${run}`,
      supplyVolts: 230,
      breakerAmps: 32,
      breakerCurve: 'C',
      rcdMa: 100,
      rcdType: 'S',
    }
    const made = await request(t.app).post('/api/v1/circuits').set('Authorization', admin).send(body)
    expect(made.status).toBe(201)
    expect(made.body.rcdType).toBe('S')
    ids.s = made.body.id
    const bad = await request(t.app)
      .post('/api/v1/circuits')
      .set('Authorization', admin)
      .send({ ...body, ref: `PX-${run}`, rcdType: 'AC' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('validation_failed')
    expect(bad.body.error.details.fields[0].path).toMatch(/rcdType/)
  })
})

describe('RCD tests judged by the circuit’s RCD type', () => {
  it('takes the type and rating from the circuit: a 100 mA type S at 200 ms / 90 ms is advisory, not fail', async () => {
    // Type S: 130–500 ms at 1×, 50–150 ms at 5× (BS EN 61008-1): within. Not additional protection
    // (over 30 mA, and time-delayed: BS 7671 reg 415.1.1) → advisory.
    const res = await record({
      kind: 'rcd_test',
      subjectId: ids.s,
      readings: { noTripAtHalf: true, tripMsAt1x: 200, tripMsAt2x: 120, tripMsAt5x: 90 },
    })
    expect(res.status).toBe(201)
    expect(res.body.result).toBe('advisory')
    expect(res.body.findings.map((f: { code: string }) => f.code)).toEqual(['no_additional_protection'])
    const row = await t.db('certificates').where({ id: res.body.id }).first('readings')
    const stored = typeof row.readings === 'string' ? JSON.parse(row.readings) : row.readings
    expect(stored).toMatchObject({ rcdType: 'S', ratedMa: 100 })
    const item = await t
      .db('queueItems')
      .where({ openKey: `rcd_failed:circuit-rcd:${ids.s}`, state: 'open' })
      .first()
    expect(item).toBeUndefined()
  })

  it('fails a type S that trips in 40 ms at 5× (floor 50 ms): too fast to discriminate', async () => {
    const res = await record({
      kind: 'rcd_test',
      subjectId: ids.s,
      readings: { tripMsAt1x: 200, tripMsAt5x: 40 },
    })
    expect(res.body.result).toBe('fail')
    expect(res.body.findings[0].code).toBe('rcd_too_fast')
    expect(res.body.reasons[0]).toMatch(/50–150 ms/)
  })

  it('fails a general type that tripped at ½ × IΔn or took 160 ms at 2× (limit 150 ms)', async () => {
    const half = await record({ kind: 'rcd_test', subjectId: ids.general, readings: { noTripAtHalf: false } })
    expect(half.body).toMatchObject({ result: 'fail' })
    expect(half.body.findings[0].code).toBe('rcd_tripped_at_half')
    const slow = await record({ kind: 'rcd_test', subjectId: ids.general, readings: { tripMsAt2x: 160 } })
    expect(slow.body.findings[0]).toMatchObject({ code: 'rcd_slow', level: 'fail' })
  })

  it('answers 400 with a field path for a reading of the wrong kind', async () => {
    const res = await record({ kind: 'rcd_test', subjectId: ids.general, readings: { noTripAtHalf: 'no' } })
    expect(res.status).toBe(400)
    expect(res.body.error.details.fields[0].path).toMatch(/noTripAtHalf/)
  })
})

describe('insulation judged by the circuit voltage', () => {
  it('fails a 230 V circuit tested at 250 V reading 0.5 MΩ (minimum 1.0 MΩ, Table 64 / reg 643.3)', async () => {
    const res = await record({
      kind: 'insulation_test',
      subjectId: ids.general,
      readings: { testVolts: 250, megohms: 0.5 },
    })
    expect(res.body.result).toBe('fail')
    expect(res.body.findings.map((f: { code: string }) => f.code)).toEqual([
      'insulation_low',
      'insulation_test_volts_low',
    ])
    const row = await t.db('certificates').where({ id: res.body.id }).first('readings')
    const stored = typeof row.readings === 'string' ? JSON.parse(row.readings) : row.readings
    expect(stored.circuitVolts).toBe(230)
  })
})

describe('certificates stored before RCD types', () => {
  it('lists an old RCD row without rcdType and gives the circuit’s facts for a new test', async () => {
    const [id] = await t.db('certificates').insert({
      kind: 'rcd_test',
      subjectType: 'circuit',
      subjectId: ids.general,
      doneOn: today,
      result: 'pass',
      readings: JSON.stringify({ ratedMa: 30, tripMsAt1x: 22, tripMsAt5x: 14 }),
    })
    const list = await request(t.app).get('/api/v1/certificates?kind=rcd_test').set('Authorization', safety)
    expect(list.status).toBe(200)
    const row = list.body.items.find((c: { id: number }) => c.id === id)
    expect(row.readings).toEqual({ ratedMa: 30, tripMsAt1x: 22, tripMsAt5x: 14 })
    expect(row.circuit).toEqual({ supplyVolts: 230, rcdMa: 30, rcdType: 'general' })
  })
})
