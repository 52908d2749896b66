// Forecasts and tour search run on worker threads behind cost caps and per-user job slots.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import type { Server } from 'node:http'
import { makeTestApp, type TestApp } from './helpers'
import { forecast } from '../../shared/engine/forecast'
import { forecastRequestSchema } from '../../shared/schemas/engine'
import { runInPool } from '../../server/workers/pool'

let t: TestApp
let server: Server
let crew: string
let supervisor: string
beforeAll(async () => {
  t = await makeTestApp()
  // One listening server for every request, so probes do not each pay for a new one.
  server = t.app.listen(0)
  crew = `Bearer ${await t.token('crew')}`
  supervisor = `Bearer ${await t.token('supervisor')}`
})
afterAll(async () => {
  await new Promise((r) => server.close(r))
  await t.close()
})

const forecastPath = '/api/v1/engine/forecast'
const solvePath = '/api/v1/routing/solve'

// The heaviest shape the cap allows: 50 classes of different ratings (no shared stress table) and
// no shunt ever opening, 2,000 lamps × 1,000 trials = 2,000,000 lamp-trials, about 1 s on one core.
const largestForecast = {
  supplyVolts: 120,
  ratedLifeHours: 3000,
  lamps: Array.from({ length: 50 }, (_, i) => ({ count: 40, ratedVolts: 0.06 + i * 0.001, ratedAmps: 0.3 })),
  shuntFailProbability: 0,
  trials: 1000,
}

// 1,000 random points on a 10 km square; travel costs are rounded straight-line metres.
function tourWithMatrix(n: number) {
  let s = 7
  const rnd = () => (s = (s * 16807) % 2147483647) / 2147483647
  const pts = Array.from({ length: n }, () => [rnd() * 10_000, rnd() * 10_000])
  return {
    stops: pts.map((_, i) => ({ id: `s${i}` })),
    matrix: pts.map((a) => pts.map((b) => Math.round(Math.hypot(a[0] - b[0], a[1] - b[1])))),
  }
}

const post = (path: string, auth: string, body: string | object) =>
  request(server).post(path).set('Authorization', auth).send(body)

describe('cost caps, checked before any work', () => {
  it('refuses 500,000 lamps × 20,000 trials with 413 too_large within 1 s', async () => {
    const body = {
      supplyVolts: 230,
      ratedLifeHours: 1000,
      lamps: Array.from({ length: 50 }, () => ({ count: 10_000, ratedVolts: 0.023, ratedAmps: 0.3 })),
      trials: 20_000,
    }
    const started = performance.now()
    const res = await post(forecastPath, crew, body)
    expect(performance.now() - started).toBeLessThan(1000)
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('too_large')
    // The limit is issue 8's (item 7): trials × lamps in circuit at most 2,000,000.
    expect(res.body.error.details).toEqual({ limit: 2_000_000, cost: 500_000 * 20_000 })
    // 2,000,000 / 500,000 lamps: the message says how to make it fit.
    expect(res.body.error.message).toMatch(/at most 4 trials/)
  })

  it('counts only lamps in circuit: failed shunted lamps carry no work', async () => {
    // 2,001 lamps, 1 failed → 2,000 in circuit × 1,000 trials = exactly the limit.
    const body = { ...largestForecast, lamps: [{ count: 2001, failed: 1, ratedVolts: 0.06, ratedAmps: 0.3 }] }
    expect((await post(forecastPath, crew, body)).status).toBe(200)
    const over = await post(forecastPath, crew, { ...body, trials: 1001 })
    expect(over.status).toBe(413)
    expect(over.body.error.details).toEqual({ limit: 2_000_000, cost: 2_002_000 })
  })

  it('refuses a 1,000-stop search for 30 s, naming the limit and a time that fits', async () => {
    const res = await post(solvePath, supervisor, { ...tourWithMatrix(1000), timeLimitMs: 30_000 })
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('too_large')
    // The limit is chosen in shared/routing/limits.ts (no published source): 1,000 stops × 1 s fits.
    expect(res.body.error.details).toEqual({ limit: 5_000_000, cost: 30_000_000 })
    expect(res.body.error.message).toMatch(/timeLimitMs to at most 5,000/)
  })
})

describe('work off the event loop', () => {
  // Both jobs at once, probing /health every 50 ms until both are answered; returns the slowest probe.
  async function slowestProbeWhileBusy(tour: string): Promise<number> {
    let done = 0
    const jobs = [
      post(forecastPath, crew, largestForecast),
      post(solvePath, supervisor, tour).type('json'),
    ].map((p) =>
      p.then((res) => {
        done++
        return res
      }),
    )
    const latencies: number[] = []
    while (done < 2) {
      const started = performance.now()
      const health = await request(server).get('/api/v1/health')
      latencies.push(performance.now() - started)
      expect(health.status).toBe(200)
      await new Promise((r) => setTimeout(r, 50))
    }
    const [fc, solved] = await Promise.all(jobs)
    expect(fc.status).toBe(200)
    expect(solved.status).toBe(200)
    expect(new Set(solved.body.order).size).toBe(1000)
    // At least a second of work was watched (each job alone takes about that long).
    expect(latencies.length).toBeGreaterThanOrEqual(10)
    return Math.max(...latencies)
  }

  it('answers /health within 100 ms while the largest forecast and a 1,000-stop solve run', async () => {
    // Serialised up front: a real client does this on its own machine, not on the server's event loop.
    const tour = JSON.stringify(tourWithMatrix(1000))
    // The test machine is shared: a process the OS sets aside can miss 100 ms once. Work on the event
    // loop would miss it by seconds in every attempt (2,000 lamps × 2,000 trials stalled it for 2 s).
    const slowest: number[] = []
    for (let attempt = 0; attempt < 3 && !(Math.min(...slowest) < 100); attempt++) {
      slowest.push(await slowestProbeWhileBusy(tour))
      expect(slowest.at(-1)).toBeLessThan(1000)
    }
    expect(Math.min(...slowest)).toBeLessThan(100)
  }, 60_000)

  it('gives the same forecast as the shared function called directly with the same seed', async () => {
    // A plumbing check (request → worker thread → answer), not of the engine: tests/shared covers that.
    const body = {
      supplyVolts: 230,
      ratedLifeHours: 1500,
      lamps: [{ count: 20, ratedVolts: 12, ratedAmps: 0.5, failed: 2, shunted: true }],
      trials: 300,
      seed: 11,
    }
    const res = await post(forecastPath, crew, body)
    expect(res.status).toBe(200)
    const direct = forecast(forecastRequestSchema.parse(body))
    expect(res.body).toEqual(JSON.parse(JSON.stringify(direct)))
  })

  it('answers a bad matrix found on the worker thread with 400 validation_failed', async () => {
    const res = await post(solvePath, supervisor, {
      stops: [{ id: 'a' }, { id: 'b' }],
      matrix: [
        [0, -1],
        [1, 0],
      ],
    })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.fields[0].path).toBe('body.matrix.0.1')
  })

  it('stops a job that runs past its wall-clock limit, and the pool carries on', async () => {
    const late = runInPool('forecast', forecastRequestSchema.parse(largestForecast), { timeoutMs: 50 })
    await expect(late).rejects.toMatchObject({ status: 503, code: 'job_timeout' })
    const ok = await post(forecastPath, crew, { ...largestForecast, trials: 10 })
    expect(ok.status).toBe(200)
  })
})

describe('per-user job slots', () => {
  it('answers a third concurrent job by the same user with 429 too_many_jobs and Retry-After', async () => {
    const first = post(forecastPath, crew, largestForecast).then((r) => r)
    const second = post(forecastPath, crew, largestForecast).then((r) => r)
    // Both are running or waiting for a thread for well over a second.
    await new Promise((r) => setTimeout(r, 300))
    const third = await post(forecastPath, crew, largestForecast)
    expect(third.status).toBe(429)
    expect(third.body.error.code).toBe('too_many_jobs')
    expect(Number(third.headers['retry-after'])).toBeGreaterThan(0)
    // Another user is not held back by the crew member's jobs.
    const other = await post(forecastPath, supervisor, { ...largestForecast, trials: 10 })
    expect(other.status).toBe(200)
    expect((await first).status).toBe(200)
    expect((await second).status).toBe(200)
    // Slots come back when jobs end.
    expect((await post(forecastPath, crew, { ...largestForecast, trials: 10 })).status).toBe(200)
  })

  it('gives the slot back when a job fails', async () => {
    const bad = {
      stops: [{ id: 'a' }, { id: 'b' }],
      matrix: [
        [0, 'x'],
        [1, 0],
      ],
    }
    for (let i = 0; i < 3; i++) expect((await post(solvePath, supervisor, bad)).status).toBe(400)
  })
})
