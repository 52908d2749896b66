import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import express from 'express'
import type { Server } from 'node:http'
import { makeTestApp, type TestApp } from './helpers'

// A local stand-in for an OSRM-compatible routing service: its table endpoint answers every pair of
// places with 12 minutes (720 s), in the response shape of the OSRM HTTP API (table service).
let fake: Server
let url = ''
const seen: string[] = []
beforeAll(async () => {
  const app = express()
  app.get('/table/v1/driving/:coords', (req, res) => {
    seen.push(String(req.query.annotations))
    const n = String(req.params.coords).split(';').length
    res.json({
      code: 'Ok',
      durations: Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => (i === j ? 0 : 720)),
      ),
    })
  })
  app.get('/broken/table/v1/driving/:coords', (_req, res) => {
    res.status(500).json({ code: 'InternalError' })
  })
  fake = await new Promise((r) => {
    const s = app.listen(0, '127.0.0.1', () => r(s))
  })
  url = `http://127.0.0.1:${(fake.address() as { port: number }).port}`
})
afterAll(() => new Promise<void>((r) => fake.close(() => r())))

async function plan(t: TestApp) {
  const sup = `Bearer ${await t.token('supervisor')}`
  const items = (await request(t.app).get('/api/v1/queue').set('Authorization', sup)).body.items
    .filter(
      (i: { lat: number | null; site: { accessFrom: string | null } | null }) =>
        i.lat !== null && !i.site?.accessFrom,
    )
    .slice(0, 4)
  const crew = (await request(t.app).get('/api/v1/crews').set('Authorization', sup)).body.items.find(
    (c: { name: string }) => c.name === 'Lantern',
  )
  return request(t.app)
    .post('/api/v1/runs/plan')
    .set('Authorization', sup)
    .send({ date: '2026-12-02', crewIds: [crew.id], itemIds: items.map((i: { id: number }) => i.id) })
}

describe('travel times from a routing service (ROUTING_URL)', () => {
  it('plans with the service’s travel times when it answers', async () => {
    const t = await makeTestApp({ ROUTING_URL: url })
    const res = await plan(t)
    expect(res.status).toBe(200)
    expect(res.body.travelSource).toBe('routing_service')
    expect(seen).toContain('duration')
    const stops = res.body.runs[0].stops
    expect(stops.length).toBeGreaterThan(0)
    for (const s of stops) expect(s.travelMinutes).toBe(12)
    await t.close()
  })

  it('falls back to straight-line travel when the service fails', async () => {
    const t = await makeTestApp({ ROUTING_URL: `${url}/broken` })
    const res = await plan(t)
    expect(res.status).toBe(200)
    expect(res.body.travelSource).toBe('straight_line')
    await t.close()
  })
})
