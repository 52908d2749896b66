// POST /api/v1/routing/solve-vrptw: who may call it, the 400/413 answers with their codes and ids,
// and one small solve through the worker pool.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import type { Server } from 'node:http'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let server: Server
let crew: string
let supervisor: string
beforeAll(async () => {
  t = await makeTestApp()
  server = t.app.listen(0)
  crew = `Bearer ${await t.token('crew')}`
  supervisor = `Bearer ${await t.token('supervisor')}`
})
afterAll(async () => {
  await new Promise((r) => server.close(r))
  await t.close()
})

const path = '/api/v1/routing/solve-vrptw'
const post = (auth: string, body: string | object) =>
  request(server)
    .post(path)
    .set('Authorization', auth)
    .set('Content-Type', 'application/json')
    .send(typeof body === 'string' ? body : JSON.stringify(body))

// Depot at the origin, open 0–100; stops on the x axis, so distance = travel time = |x|.
const base = {
  depot: { x: 0, y: 0, ready: 0, due: 100 },
  vehicles: { count: 2, capacity: 10 },
  stops: [
    { id: 'a', x: 10, y: 0, demand: 4, ready: 0, due: 15, service: 5 },
    { id: 'b', x: 20, y: 0, demand: 4, ready: 0, due: 100, service: 5 },
  ],
  timeLimitMs: 50,
}

describe('POST /routing/solve-vrptw', () => {
  it('is for planners only: a crew member gets 403', async () => {
    expect((await post(crew, base)).status).toBe(403)
  })

  it('serves both stops on one route: depot–a–b–depot is 10 + 10 + 20 = 40 (hand calculation)', async () => {
    const res = await post(supervisor, base)
    expect(res.status).toBe(200)
    // One route of 40 beats two out-and-back routes (20 + 40 = 60); demand 8 ≤ 10; a starts at 10 ≤ 15,
    // b at 10 + 5 + 10 = 25, back at 25 + 5 + 20 = 50 ≤ 100. The other order reaches a at 20 + 5 + 10 =
    // 35 > 15, so a comes first.
    expect(res.body.routes).toEqual([['a', 'b']])
    expect(res.body.distance).toBeCloseTo(40, 9)
    expect(res.body.unserved).toEqual([])
  })

  it('refuses duplicate ids with 400 duplicate_stop_ids naming them', async () => {
    const body = { ...base, stops: [...base.stops, { ...base.stops[0] }] }
    const res = await post(supervisor, body)
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('duplicate_stop_ids')
    expect(res.body.error.details).toEqual({ ids: ['a'] })
  })

  it('refuses a non-finite number (1e999 reads as Infinity) with 400 non_finite_number naming the stop', async () => {
    const json = JSON.stringify(base).replace('"x":20', '"x":1e999')
    const res = await post(supervisor, json)
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('non_finite_number')
    expect(res.body.error.details).toEqual({ ids: ['b'] })
  })

  it('refuses a stop no vehicle can reach in time with 400 stop_unreachable', async () => {
    // Stop c at x = 60 is 60 away: arrival 60 > due 50 even straight from the depot (hand calculation).
    // Stop d at x = 45, due 100: 45 there + 20 service + 45 back = 110 > depot due 100.
    const body = {
      ...base,
      stops: [
        ...base.stops,
        { id: 'c', x: 60, y: 0, demand: 1, ready: 0, due: 50, service: 0 },
        { id: 'd', x: 45, y: 0, demand: 1, ready: 0, due: 100, service: 20 },
      ],
    }
    const res = await post(supervisor, body)
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('stop_unreachable')
    expect(res.body.error.details).toEqual({ ids: ['c', 'd'] })
  })

  it('answers other bad shapes with 400 validation_failed', async () => {
    const res = await post(supervisor, { ...base, vehicles: { count: 0, capacity: 10 } })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
  })

  it('refuses more than 1,000 stops with 413 too_many_stops', async () => {
    const stops = Array.from({ length: 1001 }, (_, i) => ({ ...base.stops[0], id: `s${i}` }))
    const res = await post(supervisor, { ...base, stops })
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('too_many_stops')
  })

  it('refuses a search over the stop-millisecond cap with 413 too_large', async () => {
    // 1,000 stops × 6,000 ms = 6,000,000 > 5,000,000 (shared/routing/limits.ts MAX_TOUR_COST).
    const stops = Array.from({ length: 1000 }, (_, i) => ({ ...base.stops[0], id: `s${i}` }))
    const res = await post(supervisor, { ...base, stops, timeLimitMs: 6000 })
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('too_large')
    expect(res.body.error.details).toEqual({ limit: 5_000_000, cost: 6_000_000 })
  })
})
