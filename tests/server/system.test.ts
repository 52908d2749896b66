import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { allRoutes } from '../../server/routes/index'
import { openApiPath } from '../../server/openapi'
import { createDb } from '../../server/db'
import { createApp } from '../../server/app'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

describe('plumbing', () => {
  it('reports health with the database', async () => {
    const res = await request(t.app).get('/api/v1/health')
    expect(res.status).toBe(200)
    expect(res.body).toEqual({ status: 'ok', db: 'ok' })
  })

  it('answers 503 when the database is down', async () => {
    const dead = createDb('mysql://nobody:x@127.0.0.1:1/none')
    const app = createApp({ ...t.deps, db: dead }, { clientDir: '/nonexistent' })
    const res = await request(app).get('/api/v1/health')
    expect(res.status).toBe(503)
    expect(res.body.db).toBe('down')
    await dead.destroy()
  })

  it('answers unknown API paths with 404 not_found in the error shape', async () => {
    const res = await request(t.app).get('/api/v1/no-such-thing')
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('not_found')
  })

  it('never sends a stack trace; bad JSON is a 400 with a code', async () => {
    const res = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email":')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('invalid_json')
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/)
  })

  it('tags every response with a request id', async () => {
    const res = await request(t.app).get('/api/v1/health')
    expect(res.headers['x-request-id']).toMatch(/^[\w-]{8,}$/)
  })
})

describe('OpenAPI document', () => {
  it('lists every mounted route with its method, schemas and x-roles', async () => {
    const res = await request(t.app).get('/api/v1/openapi.json')
    expect(res.status).toBe(200)
    const paths = res.body.paths as Record<string, Record<string, { 'x-roles': string[]; responses: object }>>
    for (const r of allRoutes) {
      const op = paths[openApiPath(r.path)]?.[r.method]
      expect(op, `${r.method.toUpperCase()} ${r.path} missing from openapi.json`).toBeDefined()
      expect(Array.isArray(op['x-roles']) && op['x-roles'].length > 0).toBe(true)
      expect(op.responses).toBeDefined()
    }
    expect(paths['/api/v1/auth/sign-in'].post['x-roles']).toEqual(['public'])
    expect(paths['/api/v1/users'].get['x-roles']).toEqual(['admin'])
  })

  it('has no route that Express answers but the document omits', async () => {
    const doc = (await request(t.app).get('/api/v1/openapi.json')).body
    const documented = new Set(
      Object.entries(doc.paths as Record<string, object>).flatMap(([p, ops]) =>
        Object.keys(ops).map((m) => `${m} ${p}`),
      ),
    )
    // Walk Express's own router: every route it mounted under /api/v1 must be in the document.
    type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } }
    const mounted: string[] = []
    const walk = (stack: Layer[]) => {
      for (const l of stack) {
        if (l.route)
          for (const m of Object.keys(l.route.methods)) mounted.push(`${m} ${openApiPath(l.route.path)}`)
        else if (l.handle?.stack) walk(l.handle.stack)
      }
    }
    walk((t.app as unknown as { router: { stack: Layer[] } }).router.stack)
    const apiRoutes = mounted.filter((m) => !m.endsWith('/openapi.json'))
    expect(apiRoutes.length).toBeGreaterThan(5)
    for (const m of apiRoutes) expect(documented.has(m), `${m} is not in openapi.json`).toBe(true)
  })
})

describe('mail outbox (demo only, admins only)', () => {
  const outbox = async (app: TestApp, role: 'crew' | 'admin') =>
    request(app.app)
      .get('/api/v1/mail')
      .set('Authorization', `Bearer ${await app.token(role)}`)

  it('is closed to every role but admin, even in demo mode', async () => {
    const demo = await makeTestApp({ DEMO_MODE: 'true' })
    try {
      const id = (await demo.db('caughtMail').first('id'))?.id ?? 1
      for (const role of ['crew', 'supervisor', 'manager', 'safety'] as const) {
        const auth = `Bearer ${await demo.token(role)}`
        expect((await request(demo.app).get('/api/v1/mail').set('Authorization', auth)).status).toBe(403)
        const one = await request(demo.app).get(`/api/v1/mail/${id}`).set('Authorization', auth)
        expect(one.status).toBe(403)
        expect(one.body.error.code).toBe('forbidden')
      }
      expect((await outbox(demo, 'admin')).status).toBe(200)
    } finally {
      await demo.close()
    }
  })

  it('does not exist outside demo mode, nor when mail goes to a real SMTP server', async () => {
    const settings: Record<string, string>[] = [
      { DEMO_MODE: 'false' },
      { DEMO_MODE: 'true', SMTP_URL: 'smtp://mail.example:587' },
    ]
    for (const env of settings) {
      const app = await makeTestApp(env)
      try {
        const res = await outbox(app, 'admin')
        expect(res.status).toBe(404)
        expect(res.body.error.code).toBe('not_found')
        const one = await request(app.app)
          .get('/api/v1/mail/1')
          .set('Authorization', `Bearer ${await app.token('admin')}`)
        expect(one.status).toBe(404)
        expect((await request(app.app).get('/api/v1/config')).body.mailOutbox).toBe(false)
      } finally {
        await app.close()
      }
    }
  })
})

describe('demo data (demo mode only, read from what the seed stored)', () => {
  it('shows the demo accounts and drawn streets in demo mode and neither outside it', async () => {
    const demo = await makeTestApp({ DEMO_MODE: 'true' })
    const real = await makeTestApp({ DEMO_MODE: 'false' })
    try {
      const shown = (await request(demo.app).get('/api/v1/config')).body
      expect(shown.demoAccounts.map((a: { email: string }) => a.email)).toContain('crew@example.org')
      expect(shown.demoPassword).toBe('lampwright')
      const streets = await request(demo.app).get('/api/v1/basemap')
      expect(streets.status).toBe(200)
      expect(streets.body.features.length).toBeGreaterThan(0)

      const hidden = (await request(real.app).get('/api/v1/config')).body
      expect([hidden.demoAccounts, hidden.demoPassword]).toEqual([[], null])
      const none = await request(real.app).get('/api/v1/basemap')
      expect([none.status, none.body.error.code]).toEqual([404, 'not_found'])
    } finally {
      await demo.close()
      await real.close()
    }
  })
})

describe('the base of printed links (README, Settings: PUBLIC_URL)', () => {
  it('is PUBLIC_URL without its trailing slash when set, and absent otherwise', async () => {
    const pub = await makeTestApp({ PUBLIC_URL: 'https://lights.example.org/' })
    try {
      expect((await request(pub.app).get('/api/v1/config')).body.publicUrl).toBe('https://lights.example.org')
      expect((await request(t.app).get('/api/v1/config')).body.publicUrl).toBeNull()
    } finally {
      await pub.close()
    }
  })
})
