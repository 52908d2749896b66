// For the benchmarks that need a large register: a throw-away database (in .bench-data, or
// BENCH_DATA_DIR) holding the demo town copied until it has 20,000 strings, and the real app over
// HTTP on a free port in this process (scripts/bench/api.ts runs npm start's cluster against it instead).
import { openDatabase, prepareDatabase, throwAwayDatabaseUrl } from '../setup'
import { createDb, type Db } from '../../server/db'
import { createApp } from '../../server/app'
import { loadConfig } from '../../server/config'
import type { Mailer } from '../../server/mail/mailer'
import { rng } from '../../seeds/demo/geo'
import { localFileStore } from '../../server/files/local-store'

export const TARGET_STRINGS = 20_000

export interface BenchApp {
  knex: Db
  /** Strings in the database once built. */
  count: number
  base: string
  token(email: string): Promise<string>
  close(): Promise<void>
}

/** JSON columns (line, lampExposure, …) arrive parsed: written back as JSON text, not as lists of values. */
const jsonColumns = (row: Record<string, unknown>) =>
  Object.fromEntries(
    Object.entries(row).map(([k, v]) => [
      k,
      v !== null && typeof v === 'object' && !(v instanceof Date) ? JSON.stringify(v) : v,
    ]),
  )

const lineOf = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as [number, number][]

/** Copies of the demo town tiled over a wider area, as a contractor serving many towns would have. */
async function tileStrings(knex: Db, target: number): Promise<void> {
  const base = await knex('strings').select('*')
  const r = rng(99)
  let n = base.length
  for (let copy = 1; n < target; copy++) {
    const dLat = Math.floor(copy / 8) * 0.03
    const dLng = (copy % 8) * 0.05
    const rows = base.slice(0, target - n).map((s) => {
      const { id: _id, createdAt: _c, updatedAt: _u, ...rest } = s
      return {
        ...jsonColumns(rest),
        assetTag: `${s.assetTag}-${copy}`,
        lat: s.lat + dLat,
        lng: s.lng + dLng,
        line: s.line ? JSON.stringify(lineOf(s.line).map(([x, y]) => [x + dLng, y + dLat])) : null,
        status: r.pick(['lit', 'lit', 'lit', 'watch', 'replace', 'dark']),
      }
    })
    for (let i = 0; i < rows.length; i += 500) await knex('strings').insert(rows.slice(i, i + 500))
    n += rows.length
  }
}

export interface BenchDatabase {
  url: string
  knex: Db
  /** The bench's data folder (BENCH_DATA_DIR, default .bench-data). */
  dir: string
  /** Strings in the database once built. */
  count: number
  /** Closes the pool and stops the MariaDB if this call started it. */
  close(): Promise<void>
}

/** The bench database freshly seeded and filled to `strings` strings (0: the demo as it is). */
export async function openBenchDatabase(strings = TARGET_STRINGS): Promise<BenchDatabase> {
  // The benchmark wipes its database: an external one only when its name says so.
  throwAwayDatabaseUrl(process.env)
  const dir = process.env.BENCH_DATA_DIR ?? '.bench-data'
  const db = await openDatabase({
    dir,
    port: Number(process.env.DB_BENCH_PORT ?? 3309),
    name: 'lampwright_bench',
  })
  try {
    await prepareDatabase(db.url, { seed: 'always' })
    const knex = createDb(db.url)
    if (strings) await tileStrings(knex, strings)
    const count = Number((await knex('strings').count({ n: '*' }))[0].n)
    return {
      url: db.url,
      knex,
      dir,
      count,
      async close() {
        await knex.destroy()
        if (db.startedHere) await db.stop()
      },
    }
  } catch (err) {
    if (db.startedHere) await db.stop()
    throw err
  }
}

/** Signs in a demo account (password "lampwright") and answers its token. */
export async function signIn(base: string, email: string): Promise<string> {
  const res = await fetch(`${base}/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: 'lampwright' }),
  })
  if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status} ${await res.text()}`)
  return ((await res.json()) as { token: string }).token
}

/** The bench database (see openBenchDatabase) and the real app over HTTP in this process. */
export async function openBenchApp(strings = TARGET_STRINGS): Promise<BenchApp> {
  const db = await openBenchDatabase(strings)
  try {
    const config = loadConfig({
      ...process.env,
      DATABASE_URL: db.url,
      JWT_SECRET: 'bench-secret-long-enough-0123456789',
      LOG_LEVEL: 'silent',
    })
    const mailer: Mailer = { send: async () => ({ id: 0, sent: false }) }
    const app = createApp(
      {
        db: db.knex,
        config,
        jwtSecret: config.JWT_SECRET!,
        mailer,
        files: localFileStore(`${db.dir}/uploads`),
      },
      { clientDir: '/none' },
    )
    const server = app.listen(0)
    const base = `http://127.0.0.1:${(server.address() as { port: number }).port}/api/v1`
    return {
      knex: db.knex,
      count: db.count,
      base,
      token: (email) => signIn(base, email),
      async close() {
        server.close()
        await db.close()
      },
    }
  } catch (err) {
    await db.close()
    throw err
  }
}

/** p50 and p95 of a list of timings. */
export function percentiles(times: number[]): { p50: number; p95: number } {
  const s = [...times].sort((a, b) => a - b)
  const p = (q: number) => s[Math.min(s.length - 1, Math.floor(q * s.length))]
  return { p50: p(0.5), p95: p(0.95) }
}
