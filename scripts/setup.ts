// Set-up shared by npm start, npm run dev and npm test: database, migrations, demo data, build.
import { execFileSync } from 'node:child_process'
import { existsSync, readdirSync, statSync } from 'node:fs'
import { join } from 'node:path'
import { startPrivateDb, type PrivateDb } from './db/private-db'
import { createDb } from '../server/db'
import { seedDemo } from '../seeds/demo/index'

export interface Database {
  url: string
  startedHere: boolean
  stop(): Promise<void>
}

/** DATABASE_URL when set; otherwise a private MariaDB in `dir` on 127.0.0.1:`port`. */
export async function openDatabase(opts: {
  dir: string
  port: number
  name: string
  fresh?: boolean
}): Promise<Database> {
  if (process.env.DATABASE_URL)
    return { url: process.env.DATABASE_URL, startedHere: false, stop: async () => {} }
  const db: PrivateDb = await startPrivateDb({
    dir: opts.dir,
    port: opts.port,
    database: opts.name,
    fresh: opts.fresh,
  })
  return db
}

/** Runs pending migrations; loads the demo town when the database has no strings (or when forced). */
export async function prepareDatabase(
  url: string,
  opts: { seed: 'if-empty' | 'always' | 'never' },
): Promise<void> {
  const db = createDb(url)
  try {
    const [, pending] = await db.migrate.latest()
    if (pending?.length) console.log(`Applied ${pending.length} migration(s).`)
    const empty = Number((await db('strings').count({ n: '*' }))[0].n) === 0
    if (opts.seed === 'always' || (opts.seed === 'if-empty' && empty)) {
      const stats = await seedDemo(db, new Date())
      console.log(`Loaded the demo town: ${stats.strings} strings, ${stats.visits} visits.`)
    }
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
