// The private MariaDB is closed: root only through the socket in a 0700 folder, secrets 0600, and a
// data folder made by the older set-up (root without a password) is hardened without losing data.
import { afterAll, describe, expect, it } from 'vitest'
import { execFileSync, spawn } from 'node:child_process'
import { mkdtempSync, rmSync, statSync, writeFileSync, chmodSync } from 'node:fs'
import { join } from 'node:path'
import { setTimeout as sleep } from 'node:timers/promises'
import mysql from 'mysql2/promise'
import { startPrivateDb, type PrivateDb } from '../../scripts/db/private-db'
import { createDb } from '../../server/db'

const testDir = process.env.TEST_DB_DIR ?? ''
const testPort = Number(process.env.DB_TEST_PORT)
// This suite's own port, beside DB_TEST_PORT, so runs on other test ports do not clash.
const LEGACY_PORT = testPort + 16
const mode = (path: string) => statSync(path).mode & 0o777

/** The MariaDB error number of a root login over TCP, or 0 when it was let in. */
async function rootOverTcp(port: number, password = ''): Promise<number> {
  try {
    const c = await mysql.createConnection({ host: '127.0.0.1', port, user: 'root', password })
    await c.end()
    return 0
  } catch (err) {
    const e = err as { errno?: number; code?: string }
    return e.code === 'ECONNREFUSED' ? -1 : (e.errno ?? -2)
  }
}

// ER_ACCESS_DENIED_ERROR 1045, ER_ACCESS_DENIED_NO_PASSWORD_ERROR 1698, ER_HOST_NOT_PRIVILEGED 1130
// (MariaDB server error reference).
const REFUSED = [1045, 1698, 1130]

const rootSql = (dir: string, sql: string) =>
  execFileSync('mariadb', [`--defaults-file=${join(dir, 'root.cnf')}`, '-N', '-e', sql], { encoding: 'utf8' })

describe('the private test database', () => {
  it('refuses root over TCP 127.0.0.1, with or without the root password', async () => {
    expect(REFUSED).toContain(await rootOverTcp(testPort))
    const pw = execFileSync('cat', [join(testDir, 'root-password')], { encoding: 'utf8' }).trim()
    expect(REFUSED).toContain(await rootOverTcp(testPort, pw))
  })

  it('keeps its folder 0700 (the socket is inside) and its secrets 0600', () => {
    expect(mode(testDir)).toBe(0o700)
    expect(mode(join(testDir, 'db'))).toBe(0o700)
    expect(statSync(join(testDir, 'mysqld.sock')).isSocket()).toBe(true)
    for (const f of ['db-password', 'root-password', 'root.cnf']) expect(mode(join(testDir, f))).toBe(0o600)
  })

  it('lets the developer in as root through the socket', () => {
    expect(rootSql(testDir, 'SELECT CURRENT_USER()').trim()).toBe('root@localhost')
    if (process.getuid?.() === 0) {
      const out = execFileSync(
        'mariadb',
        [`--socket=${join(testDir, 'mysqld.sock')}`, '-uroot', '-N', '-e', 'SELECT 1'],
        { encoding: 'utf8' },
      )
      expect(out.trim()).toBe('1')
    }
  })
})

// A data folder as the older scripts/db/private-db.ts left it: passwordless root on localhost,
// 127.0.0.1, ::1 and the host name; folder 0755.
async function legacyFolder(): Promise<{ dir: string; pid: number; stop(): Promise<void> }> {
  const dir = mkdtempSync('/tmp/lw-legacy-')
  chmodSync(dir, 0o755)
  const data = join(dir, 'db')
  const sock = join(dir, 'mysqld.sock')
  execFileSync(
    'mariadb-install-db',
    ['--no-defaults', '--user=root', `--datadir=${data}`, '--auth-root-authentication-method=normal'],
    { stdio: 'ignore' },
  )
  const args = [`--datadir=${data}`, `--socket=${sock}`, `--port=${LEGACY_PORT}`, '--bind-address=127.0.0.1']
  const child = spawn(
    '/usr/sbin/mariadbd',
    ['--no-defaults', '--user=root', ...args, '--skip-name-resolve'],
    {
      stdio: 'ignore',
      detached: true,
    },
  )
  child.unref()
  const root = (sql: string) =>
    execFileSync('mariadb', ['--no-defaults', `--socket=${sock}`, '-uroot', '-e', sql], { stdio: 'ignore' })
  for (let i = 0; i < 300; i++) {
    try {
      root('SELECT 1')
      break
    } catch {
      await sleep(100)
    }
  }
  writeFileSync(join(dir, 'db-password'), 'oldapppassword1234', { mode: 0o644 })
  root(`CREATE DATABASE lampwright;
        CREATE TABLE lampwright.kept (id INT PRIMARY KEY, note VARCHAR(40));
        INSERT INTO lampwright.kept VALUES (1, 'real data');
        CREATE USER 'lampwright'@'127.0.0.1' IDENTIFIED BY 'oldapppassword1234';
        GRANT ALL PRIVILEGES ON lampwright.* TO 'lampwright'@'127.0.0.1';`)
  return {
    dir,
    pid: child.pid ?? 0,
    stop: async () => {
      root('SHUTDOWN')
      await sleep(1500)
    },
  }
}

describe('an older data folder', () => {
  const cleanup: (() => Promise<void>)[] = []
  afterAll(async () => {
    for (const c of cleanup) await c()
  })

  it.each([
    ['stopped', true],
    ['still running', false],
  ])(
    'is hardened at the next start (server %s) and keeps its data',
    async (_label, stopFirst) => {
      const legacy = await legacyFolder()
      cleanup.push(async () => {
        try {
          process.kill(legacy.pid, 'SIGTERM') // only if a failed check left it running
          await sleep(1500)
        } catch {
          // already stopped
        }
        rmSync(legacy.dir, { recursive: true, force: true })
      })
      expect(await rootOverTcp(LEGACY_PORT)).toBe(0) // the hole being closed
      if (stopFirst) await legacy.stop()
      const db: PrivateDb = await startPrivateDb({
        dir: legacy.dir,
        port: LEGACY_PORT,
        database: 'lampwright',
      })
      cleanup.unshift(() => db.stop())
      expect(db.startedHere).toBe(stopFirst)
      const knex = createDb(db.url)
      try {
        expect(await knex('kept').select('note')).toEqual([{ note: 'real data' }])
      } finally {
        await knex.destroy()
      }
      expect(REFUSED).toContain(await rootOverTcp(LEGACY_PORT))
      expect(
        rootSql(legacy.dir, "SELECT Host FROM mysql.global_priv WHERE User IN ('root', '')").trim(),
      ).toBe('localhost')
      expect(mode(legacy.dir)).toBe(0o700)
      expect(mode(join(legacy.dir, 'db-password'))).toBe(0o600)
      await db.stop()
      expect(await rootOverTcp(LEGACY_PORT)).toBe(-1) // stopped: nothing answers
    },
    60_000,
  )
})
