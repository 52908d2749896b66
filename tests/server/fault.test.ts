// Nothing lost when things die: 20 clients post visits with idempotency keys (retrying each key until
// it is acknowledged) for 30 s against `npm start`'s two API processes, while the database is
// SIGKILLed and restarted once and one API process is SIGKILLed. Afterwards every acknowledged visit
// exists exactly once. Runs on its own private MariaDB, never the shared test database.
import { randomUUID } from 'node:crypto'
import { execFileSync } from 'node:child_process'
import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { setTimeout as sleep } from 'node:timers/promises'
import { afterAll, describe, expect, it } from 'vitest'
import { startPrivateDb, type PrivateDb } from '../../scripts/db/private-db'
import { createDb } from '../../server/db'
import { runStart, type Run } from './start-helpers'

const CLIENTS = 20
const LOAD_MS = 30_000
const dir = mkdtempSync(join(tmpdir(), 'lampwright-fault-'))
const dbPort = Number(process.env.DB_TEST_PORT ?? 3308) + 24
let db: PrivateDb | undefined
let app: Run | undefined

const openDb = () => startPrivateDb({ dir, port: dbPort, database: 'lampwright' })

afterAll(async () => {
  await app?.stop()
  await db?.stop()
  rmSync(dir, { recursive: true, force: true })
}, 180_000)

interface Tally {
  acked: Set<string>
  attempts: number
  retried: number
  refused: string[]
}

async function client(base: string, token: string, stringId: number, until: number, t: Tally) {
  while (Date.now() < until) {
    const key = randomUUID()
    // One key is sent until the server acknowledges it: a lost answer must not become a second visit.
    for (;;) {
      t.attempts++
      try {
        const res = await fetch(`${base}/api/v1/visits`, {
          method: 'POST',
          headers: {
            authorization: `Bearer ${token}`,
            'content-type': 'application/json',
            'idempotency-key': key,
          },
          body: JSON.stringify({ stringId, failedFound: 0, replaced: 0, notes: 'Patrol: all lit.' }),
          signal: AbortSignal.timeout(10_000),
        })
        if (res.status === 200 || res.status === 201) {
          t.acked.add(key)
          break
        }
        if ([400, 401, 403, 404].includes(res.status)) {
          t.refused.push(`${res.status} ${await res.text()}`)
          return
        }
      } catch {
        // connection reset by a dying process, or a timeout: send the same key again
      }
      t.retried++
      await sleep(200)
    }
  }
}

describe('fault tolerance under load', () => {
  it('keeps every acknowledged visit exactly once through a database restart and a killed API process', async () => {
    db = await openDb()
    // An empty database in demo mode: npm start migrates it and loads the demo town.
    app = runStart({ DATABASE_URL: db.url, DEMO_MODE: 'true', WORKERS: '2', DATA_DIR: join(dir, 'app') })
    const port = await app.ready
    const base = `http://127.0.0.1:${port}`
    const signIn = await fetch(`${base}/api/v1/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'crew@example.org', password: 'lampwright' }),
    })
    const { token } = (await signIn.json()) as { token: string }
    const check = createDb(db.url)
    const strings = (
      await check('strings').whereNull('archivedAt').orderBy('id').limit(CLIENTS).select('id')
    ).map((r) => r.id as number)
    await check.destroy()

    const tally: Tally = { acked: new Set(), attempts: 0, retried: 0, refused: [] }
    const until = Date.now() + LOAD_MS
    const load = Promise.all(strings.map((id) => client(base, token, id, until, tally)))

    await sleep(8_000)
    const dbPid = Number(readFileSync(join(dir, 'mysqld.pid'), 'utf8'))
    process.kill(dbPid, 'SIGKILL')
    await sleep(2_000)
    db = await openDb()
    await sleep(6_000)
    // The primary's cluster-worker children are the API processes: kill one outright.
    const workers = execFileSync('pgrep', ['-P', String(app.pid), '-f', 'cluster-worker'], {
      encoding: 'utf8',
    })
      .trim()
      .split('\n')
    expect(workers.length).toBe(2)
    process.kill(Number(workers[0]), 'SIGKILL')
    await load

    const after = createDb(db.url)
    try {
      const keys = [...tally.acked]
      const rows = await after('visits').whereIn('idempotencyKey', keys).select('idempotencyKey')
      const stored = new Map<string, number>()
      for (const r of rows) stored.set(r.idempotencyKey, (stored.get(r.idempotencyKey) ?? 0) + 1)
      const missing = keys.filter((k) => !stored.has(k))
      const doubled = [...stored.values()].filter((n) => n > 1).length
      console.log(
        `fault test: ${keys.length} visits acknowledged, ${rows.length} stored, ${missing.length} missing, ${doubled} doubled; ${tally.attempts} requests, ${tally.retried} retried`,
      )
      expect(tally.refused).toEqual([])
      expect(keys.length).toBeGreaterThan(100)
      expect(tally.retried).toBeGreaterThan(0)
      expect(missing).toEqual([])
      expect(doubled).toBe(0)
      expect(rows.length).toBe(keys.length)
    } finally {
      await after.destroy()
    }
    // The primary replaced the killed process: the app still answers.
    const health = await fetch(`${base}/api/v1/health`)
    expect(health.status).toBe(200)
  }, 300_000)
})
