// A real install: `DATABASE_URL=… DEMO_MODE=false ADMIN_EMAIL=… npm start` on an empty database.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createDb, type Db } from '../../server/db'
import { dropDatabase, emptyDatabase, runStart, stackLines } from './start-helpers'

const NAME = 'lampwright_test_first_admin'
const NAME_LINK = 'lampwright_test_first_admin_link'
const PASSWORD = 'a-long-admin-password'
let url = ''
let linkUrl = ''
let db: Db
let linkDb: Db

const real = () => ({ DATABASE_URL: url, DEMO_MODE: 'false' })
const signIn = (port: number, email: string, password: string) =>
  request(`http://127.0.0.1:${port}`).post('/api/v1/auth/sign-in').send({ email, password })

beforeAll(async () => {
  url = await emptyDatabase(NAME)
  linkUrl = await emptyDatabase(NAME_LINK)
  db = createDb(url)
  linkDb = createDb(linkUrl)
})

afterAll(async () => {
  await db.destroy()
  await linkDb.destroy()
  await dropDatabase(NAME)
  await dropDatabase(NAME_LINK)
})

describe('first admin at start-up', () => {
  it('refuses an ADMIN_PASSWORD under 12 characters in one line, before touching the database', async () => {
    const run = runStart({ ...real(), ADMIN_EMAIL: 'boss@example.net', ADMIN_PASSWORD: 'short-pw' })
    expect(await run.exited).toBe(1)
    const out = run.output().trim()
    expect(out).toMatch(/ADMIN_PASSWORD.*at least 12 characters/)
    expect(out.split('\n')).toHaveLength(1)
    expect(stackLines(out)).toEqual([])
    expect(await db.schema.hasTable('users')).toBe(false)
  }, 60_000)

  it('creates the admin on an empty database; that admin signs in and demo accounts do not exist', async () => {
    const run = runStart({ ...real(), ADMIN_EMAIL: 'Boss@Example.net', ADMIN_PASSWORD: PASSWORD })
    try {
      const port = await run.ready
      expect(run.output()).toContain('Created the first admin boss@example.net')
      expect(run.output()).not.toMatch(/Demo accounts/)
      const ok = await signIn(port, 'boss@example.net', PASSWORD)
      expect(ok.status).toBe(200)
      expect(ok.body.user).toMatchObject({ email: 'boss@example.net', role: 'admin' })
      const demo = await signIn(port, 'crew@example.org', 'lampwright')
      expect(demo.status).toBe(401)
      const config = await request(`http://127.0.0.1:${port}`).get('/api/v1/config')
      expect(config.body).toMatchObject({ demoMode: false, demoAccounts: [], demoPassword: null })
    } finally {
      expect(await run.stop()).toBe(0)
    }
    expect(await db('users').select('email', 'role', 'active')).toEqual([
      { email: 'boss@example.net', role: 'admin', active: 1 },
    ])
    expect(await db('strings').count({ n: '*' })).toEqual([{ n: 0 }])
    const rows = await db('auditLog').where({ action: 'create_first_admin' }).select('entityId', 'userId')
    expect(rows).toHaveLength(1)
  }, 90_000)

  it('later starts, even with other ADMIN_ settings, create no second admin and leave the first as it was', async () => {
    const before = await db('users').select()
    for (const env of [
      { ADMIN_EMAIL: 'boss@example.net', ADMIN_PASSWORD: PASSWORD },
      { ADMIN_EMAIL: 'other.boss@example.net', ADMIN_PASSWORD: 'another-long-password' },
    ]) {
      const run = runStart({ ...real(), ...env })
      try {
        const port = await run.ready
        expect(run.output()).not.toContain('Created the first admin')
        expect((await signIn(port, 'other.boss@example.net', 'another-long-password')).status).toBe(401)
      } finally {
        await run.stop()
      }
    }
    expect(before).toHaveLength(1)
    expect(await db('users').select()).toEqual(before)
    expect(await db('auditLog').where({ action: 'create_first_admin' }).count({ n: '*' })).toEqual([{ n: 1 }])
  }, 120_000)

  it('without ADMIN_EMAIL starts anyway and says in one line how to create the first admin', async () => {
    const run = runStart({ DATABASE_URL: linkUrl, DEMO_MODE: 'false' })
    try {
      const port = await run.ready
      const hint = run
        .output()
        .split('\n')
        .filter((l) => l.includes('ADMIN_EMAIL'))
      expect(hint).toEqual([expect.stringMatching(/^No admin yet: set ADMIN_EMAIL/)])
      expect((await request(`http://127.0.0.1:${port}`).get('/api/v1/health')).status).toBe(200)
    } finally {
      await run.stop()
    }
    expect(await linkDb('users').count({ n: '*' })).toEqual([{ n: 0 }])
  }, 90_000)

  it('without ADMIN_PASSWORD prints and mails a one-time set-password link', async () => {
    const run = runStart({ DATABASE_URL: linkUrl, DEMO_MODE: 'false', ADMIN_EMAIL: 'chief@example.net' })
    try {
      const port = await run.ready
      const m = /Created the first admin chief@example\.net: .* at (\S+\/accept-invite\?token=(\S+))/.exec(
        run.output(),
      )
      expect(m).not.toBeNull()
      const token = decodeURIComponent(m![2])
      const mail = await linkDb('emailOutbox').where({ toAddress: 'chief@example.net' }).select('text')
      expect(mail).toHaveLength(1)
      expect(mail[0].text).toContain(m![1])
      // Nobody can sign in before the link is used.
      expect((await signIn(port, 'chief@example.net', PASSWORD)).status).toBe(401)
      const api = request(`http://127.0.0.1:${port}`)
      const accept = await api.post('/api/v1/auth/accept-invite').send({ token, password: PASSWORD })
      expect(accept.status).toBe(200)
      expect(accept.body.user).toMatchObject({ email: 'chief@example.net', role: 'admin' })
      const again = await api.post('/api/v1/auth/accept-invite').send({ token, password: 'someone-elses-pw' })
      expect(again.status).toBe(400)
      expect(again.body.error.code).toBe('invalid_invite')
      expect((await signIn(port, 'chief@example.net', PASSWORD)).status).toBe(200)
    } finally {
      await run.stop()
    }
  }, 90_000)

  it('two instances run side by side: the mail fake takes a free port unless SMTP_FAKE_PORT is set', async () => {
    const a = runStart(real())
    const b = runStart(real())
    try {
      const [pa, pb] = await Promise.all([a.ready, b.ready])
      expect(pa).not.toBe(pb)
      for (const port of [pa, pb])
        expect((await request(`http://127.0.0.1:${port}`).get('/api/v1/health')).status).toBe(200)
    } finally {
      await Promise.all([a.stop(), b.stop()])
    }
    expect(await db('users').count({ n: '*' })).toEqual([{ n: 1 }])
  }, 90_000)
})
