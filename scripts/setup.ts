// Set-up shared by npm start, npm run dev and npm test: database, migrations, demo data, build.
import { execFileSync } from 'node:child_process'
import { existsSync, readdirSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { startPrivateDb, type PrivateDb } from './db/private-db'
import mysql from 'mysql2/promise'
import knex from 'knex'
import { knexConfig, parseDatabaseUrl } from '../server/db'
import { seedDemo } from '../seeds/demo/index'
import { StartError } from '../server/start-errors'
import { versionProblem } from './db/server-version'

export interface Database {
  url: string
  /** True for DATABASE_URL: a server npm start neither made nor owns. */
  external: boolean
  startedHere: boolean
  stop(): Promise<void>
}

/** DATABASE_URL when set; otherwise a private MariaDB in `dir` on 127.0.0.1:`port`. */
export async function openDatabase(opts: {
  dir: string
  port: number
  name: string
  fresh?: boolean
  portSetting?: string
  scratch?: boolean
}): Promise<Database> {
  if (process.env.DATABASE_URL)
    return { url: process.env.DATABASE_URL, external: true, startedHere: false, stop: async () => {} }
  const db: PrivateDb = await startPrivateDb({ ...opts, database: opts.name })
  return { ...db, external: false }
}

/**
 * npm test and the benchmarks wipe their database. They use DATABASE_URL (an external server or
 * cluster) only when its database name contains "test" or "bench"; any other is refused, never wiped.
 */
export function throwAwayDatabaseUrl(env: NodeJS.ProcessEnv): string | undefined {
  if (!env.DATABASE_URL) return undefined
  const name = new URL(env.DATABASE_URL).pathname.replace(/^\//, '')
  if (/test|bench/i.test(name)) return env.DATABASE_URL
  throw new StartError(
    `DATABASE_URL names the database "${name}", which this run would wipe: point it at a database whose name contains "test" or "bench", or unset it to use a private one.`,
  )
}

/** The user's DEMO_MODE when set; else demo mode only on the private database npm start runs. */
export function demoModeSetting(env: NodeJS.ProcessEnv): string {
  return env.DEMO_MODE || (env.DATABASE_URL ? 'false' : 'true')
}

/** One plain connection first: a refused or failed login is told at once, not retried by the pool. */
async function checkConnection(url: string): Promise<void> {
  const c = await mysql.createConnection({
    ...(parseDatabaseUrl(url) as mysql.ConnectionOptions),
    connectTimeout: 10_000,
  })
  try {
    const [rows] = await c.query<mysql.RowDataPacket[]>('select version() as v')
    const problem = versionProblem(String(rows[0].v))
    if (problem) throw new StartError(problem)
  } finally {
    await c.end()
  }
}

/**
 * Runs pending migrations, then the demo: 'if-fresh' (start-up in demo mode) loads it only into a
 * database with no users and otherwise changes nothing; 'always' wipes every table first (the test
 * database, benchmarks and the confirmed demo reset only).
 */
export async function prepareDatabase(
  url: string,
  opts: { seed: 'if-fresh' | 'always' | 'never' },
): Promise<{ seeded: boolean }> {
  // Knex's own warnings would print the failed SQL; the one-line message below says it instead.
  const quiet = process.env.LOG_LEVEL === 'debug' ? {} : { log: { warn() {}, error() {} } }
  const db = knex({ ...knexConfig(url), ...quiet })
  try {
    await checkConnection(url)
    try {
      const [, pending] = await db.migrate.latest()
      if (pending?.length) console.log(`Applied ${pending.length} migration(s).`)
    } catch (err) {
      const e = err as { sqlMessage?: string; message?: string }
      const [, left] = await db.migrate.list().catch(() => [[], []])
      const file = (left as { file?: string }[])[0]?.file ?? 'a migration'
      const why = e.sqlMessage ?? String(e.message).split('\n')[0]
      throw new StartError(`migration ${file} failed (${why}): fix it or the database, then start again`, {
        cause: err,
      })
    }
    const fresh = opts.seed === 'if-fresh' && !(await db('users').first('id'))
    if (opts.seed !== 'always' && !fresh) return { seeded: false }
    const stats = await seedDemo(db, new Date(), { wipe: opts.seed === 'always' })
    console.log(`Loaded the demo town: ${stats.strings} strings, ${stats.visits} visits.`)
    return { seeded: true }
  } finally {
    await db.destroy()
  }
}

function newest(path: string): number {
  if (!existsSync(path)) return 0
  const st = statSync(path)
  if (!st.isDirectory()) return st.mtimeMs
  let max = st.mtimeMs
  for (const e of readdirSync(path)) max = Math.max(max, newest(join(path, e)))
  return max
}

/** Builds the client when dist/ is missing or older than its sources. */
export function buildClientIfStale(force = false): void {
  const built = existsSync('dist/index.html') ? statSync('dist/index.html').mtimeMs : 0
  const sources = ['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package-lock.json']
  if (!force && built > Math.max(...sources.map(newest))) return
  console.log('Building the client...')
  execFileSync('npx', ['vite', 'build', '--logLevel', 'warn'], { stdio: 'inherit' })
}
