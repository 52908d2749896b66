// A failed npm start says in one line what went wrong and what to do, with no stack trace, and
// stops the private MariaDB it started.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createServer, type Server } from 'node:net'
import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { join } from 'node:path'
import { createDb } from '../../server/db'
import { dropDatabase, emptyDatabase, runStart, stackLines } from './start-helpers'

const DB_PORT = 3322 // this suite's own private MariaDB, beside DB_TEST_PORT
const BROKEN = 'lampwright_test_broken_migration'
let dataDir = ''
let held: Server
let heldPort = 0

const listening = (port: number) =>
  new Promise<boolean>((ok) => {
    const s = createServer()
    s.once('error', () => ok(true))
    s.listen(port, '127.0.0.1', () => s.close(() => ok(false)))
  })

function lastLine(out: string): string {
  const lines = out.trim().split('\n')
  return lines[lines.length - 1]
}

beforeAll(async () => {
  dataDir = mkdtempSync('/tmp/lw-start-')
  held = createServer()
  await new Promise<void>((r) => held.listen(0, '127.0.0.1', () => r()))
  heldPort = (held.address() as { port: number }).port
})

afterAll(async () => {
  held.close()
  rmSync(dataDir, { recursive: true, force: true })
  await dropDatabase(BROKEN)
})

describe('a start that fails', () => {
  it('on a taken PORT says so in one line and stops the MariaDB it started', async () => {
    const run = runStart({
      DATA_DIR: dataDir,
      DB_PORT: String(DB_PORT),
      PORT: String(heldPort),
      DEMO_MODE: 'false',
    })
    expect(await run.exited).toBe(1)
    const out = run.output()
    expect(lastLine(out)).toBe(`port ${heldPort} is in use: set PORT`)
    expect(stackLines(out)).toEqual([])
    // It did start its database (and migrate it) before the port failed; now nothing answers there.
    expect(existsSync(join(dataDir, 'db', 'mysql'))).toBe(true)
    expect(out).toMatch(/Applied \d+ migration/)
    expect(await listening(DB_PORT)).toBe(false)
    // MariaDB removes its pid file when it shuts down cleanly.
    expect(existsSync(join(dataDir, 'mysqld.pid'))).toBe(false)
  }, 90_000)

  it('on a taken DB_PORT names DB_PORT and starts nothing', async () => {
    const run = runStart({ DATA_DIR: dataDir, DB_PORT: String(heldPort), DEMO_MODE: 'false' })
    expect(await run.exited).toBe(1)
    expect(run.output().trim()).toBe(`port ${heldPort} is in use: set DB_PORT`)
  }, 60_000)

  it('on a failing migration says which, in one line', async () => {
    const url = await emptyDatabase(BROKEN)
    const db = createDb(url)
    // A table the first migration wants to create is already there.
    await db.raw('CREATE TABLE platforms (id INT PRIMARY KEY)').finally(() => db.destroy())
    const run = runStart({ DATABASE_URL: url, DEMO_MODE: 'false' })
    expect(await run.exited).toBe(1)
    const out = run.output().trim()
    expect(out).toMatch(
      /^migration 20261201000100_people\.ts failed \(Table 'platforms' already exists\): fix it or the database, then start again$/,
    )
    expect(out.split('\n')).toHaveLength(1)
  }, 60_000)

  it('with LOG_LEVEL=debug adds the full error', async () => {
    const run = runStart({
      DATA_DIR: dataDir,
      DB_PORT: String(heldPort),
      DEMO_MODE: 'false',
      LOG_LEVEL: 'debug',
    })
    expect(await run.exited).toBe(1)
    expect(run.output()).toContain(`port ${heldPort} is in use: set DB_PORT`)
    expect(stackLines(run.output()).length).toBeGreaterThan(0)
  }, 60_000)
})
