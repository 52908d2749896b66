import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let auth: string
beforeAll(async () => {
  t = await makeTestApp()
  auth = `Bearer ${await t.token('crew')}`
})
afterAll(() => t.close())

// trade-reference §2a (bench measurement, common practice): 20 lamps, 73 mA on 247 V, 310 Ω cold.
const lamps = [{ count: 20, ratedVolts: 12, ratedAmps: 0.07 }]

describe('engine diagnostics API', () => {
  it('judges the bench string against its hot reading and the bench ratio of 11', async () => {
    // 247 / 0.073 = 3383.56 Ω hot; / 11 = 307.60 Ω expected; 310 Ω measured is healthy.
    const res = await request(t.app)
      .post('/api/v1/engine/cold-resistance')
      .set('Authorization', auth)
      .send({ lamps, hotReading: { volts: 247, amps: 0.073 }, measuredOhms: 310 })
    expect(res.status).toBe(200)
    expect(res.body.expectedOhms).toBeCloseTo(307.6, 1)
    expect(res.body.finding).toBe('ok')
    expect(res.body.thresholds).toHaveProperty('openAboveOhms')
  })

  it('counts shorted lamps against a reference and refuses a reference without lamps', async () => {
    // 310 Ω over 20 lamps; 279 Ω → 20 × (1 − 279/310) = 2 shorted (range worked in tests/shared).
    const ok = await request(t.app)
      .post('/api/v1/engine/cold-resistance')
      .set('Authorization', auth)
      .send({ lamps, reference: { coldOhms: 310, lampsInCircuit: 20 }, measuredOhms: 279 })
    expect(ok.status).toBe(200)
    expect(ok.body.shortedEstimate).toEqual({ estimate: 2, low: 2, high: 2 })
    const bad = await request(t.app)
      .post('/api/v1/engine/cold-resistance')
      .set('Authorization', auth)
      .send({ lamps, reference: { coldOhms: 310, lampsInCircuit: 0 } })
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('validation_failed')
  })

  it('says dead short with the isolation caution for a clamp reading no string can draw', async () => {
    // One 12 V 0.25 A lamp left on 240 V draws at most about 1.44 A (worked in tests/shared); 5 A is more.
    const res = await request(t.app)
      .post('/api/v1/engine/estimate-shorted')
      .set('Authorization', auth)
      .send({ supplyVolts: 240, measuredAmps: 5, lampCount: 20, ratedVolts: 12, ratedAmps: 0.25 })
    expect(res.status).toBe(200)
    expect(res.body.finding).toBe('dead-short')
    expect(res.body.caution).toMatch(/Isolate/)
  })

  it('refuses a meter resolution out of range', async () => {
    const res = await request(t.app).post('/api/v1/engine/estimate-shorted').set('Authorization', auth).send({
      supplyVolts: 240,
      measuredAmps: 0.27,
      lampCount: 20,
      ratedVolts: 12,
      ratedAmps: 0.25,
      meterResolutionAmps: -1,
    })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
  })
})
