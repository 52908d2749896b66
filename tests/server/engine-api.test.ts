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

describe('engine API', () => {
  it('assesses 20 × 12 V on 240 V with 1 shorted: 12.632 V per lamp, life factor 0.540 at d = 12 (trade-reference §3 table)', async () => {
    const res = await request(t.app)
      .post('/api/v1/engine/assess')
      .set('Authorization', auth)
      .send({
        supplyVolts: 240,
        lifeExponent: 12,
        lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.5, failed: 1, shunted: true }],
      })
    expect(res.status).toBe(200)
    expect(res.body.classes[0].voltsPerLamp).toBeCloseTo(12.632, 3)
    expect(res.body.classes[0].lifeFactor).toBeCloseTo(0.54, 2)
    expect(res.body.replaceNow).toBe(true)
    expect(res.body.reasons.length).toBeGreaterThan(0)
  })

  it('forecasts with the same answer for the same seed', async () => {
    const body = {
      supplyVolts: 230,
      ratedLifeHours: 1500,
      lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.5, failed: 3, shunted: true }],
      trials: 500,
      seed: 7,
    }
    const a = await request(t.app).post('/api/v1/engine/forecast').set('Authorization', auth).send(body)
    const b = await request(t.app).post('/api/v1/engine/forecast').set('Authorization', auth).send(body)
    expect(a.status).toBe(200)
    expect(a.body).toEqual(b.body)
    expect(a.body.pDark.map((p: { hours: number }) => p.hours)).toEqual([24, 72, 168])
  })

  it('answers invalid engine input with 400 validation_failed and field details', async () => {
    const res = await request(t.app)
      .post('/api/v1/engine/assess')
      .set('Authorization', auth)
      .send({ supplyVolts: -5, lamps: [] })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.fields.length).toBeGreaterThan(0)
  })

  it('flags a B-curve circuit whose switch-on peak reaches 3 × rating (IEC 60898-1)', async () => {
    const res = await request(t.app)
      .post('/api/v1/engine/circuit')
      .set('Authorization', auth)
      .send({
        supplyVolts: 230,
        breakerAmps: 16,
        curve: 'B',
        strings: Array.from({ length: 6 }, () => ({ runningAmps: 0.5, peakAmps: 9 })),
      })
    expect(res.status).toBe(200)
    expect(res.body.instantaneousBand).toEqual({ lowAmps: 48, highAmps: 80 })
    expect(res.body.switchOn).toBe('may trip')
  })
})
