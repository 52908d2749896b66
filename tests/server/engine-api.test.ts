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

describe('circuit load from the register', () => {
  it('sums the strings on a circuit and judges the switch-on peak against the breaker band (IEC 60898-1)', async () => {
    const circuit = await t.db('circuits').where({ breakerCurve: 'B', breakerAmps: 16 }).first('id')
    const res = await request(t.app).get(`/api/v1/circuits/${circuit.id}/load`).set('Authorization', auth)
    expect(res.status).toBe(200)
    const r = res.body.result
    // Type B: instantaneous trip between 3 and 5 × rated current; 80 % of rating for continuous load.
    expect(r.instantaneousBand).toEqual({ lowAmps: 48, highAmps: 80 })
    expect(r.continuousLimitAmps).toBeCloseTo(12.8, 6)
    expect(r.peakAmps).toBeGreaterThan(r.runningAmps)
    expect(r.energy.kwhPerNight).toBeCloseTo((r.energy.watts * 7) / 1000, 6) // 16:00–23:00 in the demo contract
  })
})

describe('content security policy', () => {
  it('allows exactly the configured tile host for images, and no font or style host', async () => {
    const { makeTestApp } = await import('./helpers')
    const tiles = await makeTestApp({ TILE_URL: 'https://{s}.tiles.example.net/{z}/{x}/{y}.png' })
    const res = await request(tiles.app).get('/api/v1/health')
    const csp = String(res.headers['content-security-policy'])
    expect(csp).toMatch(/img-src 'self' data: blob: https:\/\/\*\.tiles\.example\.net;/)
    expect(csp).toMatch(/font-src 'self' data:;/)
    expect(csp).not.toMatch(/https:;/)
    await tiles.close()
  })
})
