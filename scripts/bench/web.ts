// npm run bench:web — the web performance budget (issue 14 part 2). Builds the client into its own
// folder (BENCH_WEB_DIR, default .bench-web), loads the demo town into a throw-away private MariaDB
// there (DB_BENCH_WEB_PORT, default 3310), serves both with the real app on PORT (default: a free
// port) and runs Lighthouse 12.2.3 with its mobile defaults in Chromium (CHROME_PATH, default
// /usr/bin/chromium) on the sign-in page, the public report page, the crew's run and the map, the
// last two signed in through the session cookie. Each page runs RUNS times (default 3) and the run
// with the median performance score is kept. Exits 1 when any page misses a target.
// SKIP_BUILD=1 reuses the last build in BENCH_WEB_DIR; BENCH_PAGES picks pages by name.
import './quiet-log'
import { execFileSync } from 'node:child_process'
import { loadavg } from 'node:os'
import { join, resolve } from 'node:path'
import type { Server } from 'node:http'
import { openDatabase, prepareDatabase } from '../setup'
import type { Mailer } from '../../server/mail/mailer'
import { audit, openBrowser, type PageFigures } from './web-lighthouse'

const DIR = resolve(process.env.BENCH_WEB_DIR ?? '.bench-web')
const RUNS = Math.max(1, Number(process.env.RUNS ?? 3))
/** BENCH_PAGES=sign-in,map: only the pages whose names contain one of these words. */
const ONLY = (process.env.BENCH_PAGES ?? '').split(',').filter(Boolean)

/** Targets of issue 14: scores per page, LCP in ms, JavaScript in kB for the two public pages. */
export const TARGETS = {
  performance: 0.95,
  accessibility: 1,
  bestPractices: 0.95,
  lcpMs: 2000,
  publicJsKb: 120,
}

interface PageSpec {
  name: string
  path: string
  as: string | null
  /** The JavaScript budget applies to the pages anyone opens first, signed out. */
  jsBudget: boolean
}
const PAGES: PageSpec[] = [
  { name: 'sign-in /', path: '/', as: null, jsBudget: true },
  { name: 'report /report', path: '/report', as: null, jsBudget: true },
  { name: 'crew run /run', path: '/run', as: 'crew@example.org', jsBudget: false },
  { name: 'map /map', path: '/map', as: 'crew@example.org', jsBudget: false },
]

function misses(p: PageFigures, spec: PageSpec): string[] {
  const out: string[] = []
  if (p.performance < TARGETS.performance) out.push(`performance < ${TARGETS.performance}`)
  if (p.accessibility < TARGETS.accessibility) out.push(`accessibility < ${TARGETS.accessibility}`)
  if (p.bestPractices < TARGETS.bestPractices) out.push(`best practices < ${TARGETS.bestPractices}`)
  if (!(p.lcp <= TARGETS.lcpMs)) out.push(`LCP > ${TARGETS.lcpMs / 1000} s`)
  if (spec.jsBudget && !(p.jsKb <= TARGETS.publicJsKb)) out.push(`JS > ${TARGETS.publicJsKb} KB`)
  return out
}

async function startServer(dbUrl: string, clientDir: string): Promise<{ base: string; close(): void }> {
  const { createDb } = await import('../../server/db')
  const { createApp } = await import('../../server/app')
  const { loadConfig } = await import('../../server/config')
  const { localFileStore } = await import('../../server/files/local-store')
  const config = loadConfig({ ...process.env, DATABASE_URL: dbUrl, DEMO_MODE: 'true', LOG_LEVEL: 'silent' })
  const knex = createDb(dbUrl)
  const mailer: Mailer = { send: async () => ({ id: 0, sent: false }) }
  const app = createApp(
    {
      db: knex,
      config,
      jwtSecret: 'bench-web-secret-long-enough-0123456789',
      mailer,
      files: localFileStore(join(DIR, 'uploads')),
    },
    { clientDir },
  )
  const server: Server = await new Promise((ok) => {
    const s = app.listen(Number(process.env.PORT ?? 0), () => ok(s))
  })
  const port = (server.address() as { port: number }).port
  return {
    base: `http://localhost:${port}`,
    close() {
      server.closeAllConnections()
      server.close()
      void knex.destroy()
    },
  }
}

/** A demo account's session token (password "lampwright"), as the browser's cookie would hold it. */
async function signIn(api: string, email: string): Promise<string> {
  const res = await fetch(`${api}/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: 'lampwright' }),
  })
  if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status} ${await res.text()}`)
  return ((await res.json()) as { token: string }).token
}

const fmt = (p: PageFigures) =>
  `| ${p.name.padEnd(16)} | ${p.performance.toFixed(2)} | ${p.accessibility.toFixed(2)} | ${p.bestPractices.toFixed(2)} | ${(p.lcp / 1000).toFixed(2)} s | ${Math.round(p.tbt)} ms | ${p.cls.toFixed(3)} | ${p.jsKb.toFixed(1)} KB |`

async function main(): Promise<number> {
  const clientDir = join(DIR, 'dist')
  if (!process.env.SKIP_BUILD) {
    console.log(`Building the client into ${clientDir}...`)
    execFileSync('npx', ['vite', 'build', '--outDir', clientDir, '--emptyOutDir', '--logLevel', 'error'], {
      stdio: ['ignore', 'ignore', 'inherit'],
    })
  }
  const db = await openDatabase({
    dir: DIR,
    port: Number(process.env.DB_BENCH_WEB_PORT ?? 3310),
    name: 'lampwright_bench_web',
  })
  let server: { base: string; close(): void } | undefined
  const browser = await openBrowser().catch(async (err) => {
    await db.stop()
    throw err
  })
  try {
    await prepareDatabase(db.url, { seed: 'always' })
    server = await startServer(db.url, clientDir)
    const api = `${server.base}/api/v1`
    const rows: { spec: PageSpec; figures: PageFigures }[] = []
    for (const spec of PAGES.filter((p) => !ONLY.length || ONLY.some((w) => p.name.includes(w)))) {
      // The session cookie (server/middleware/authenticate.ts SESSION_COOKIE), as the browser keeps it.
      const cookie = spec.as ? `lw_session=${await signIn(api, spec.as)}` : null
      const runs: PageFigures[] = []
      for (let i = 0; i < RUNS; i++) {
        runs.push(await audit(browser, spec.name, `${server.base}${spec.path}`, cookie, join(DIR, 'reports')))
        process.stdout.write('.')
      }
      runs.sort((a, b) => a.performance - b.performance)
      rows.push({ spec, figures: runs[Math.floor(runs.length / 2)] })
    }
    const load = loadavg()
      .map((l) => l.toFixed(1))
      .join(' / ')
    console.log(
      `\n\nLighthouse 12.2.3, mobile defaults, median of ${RUNS} by performance; load average ${load} (1/5/15 min)\n`,
    )
    console.log('| page             | perf | a11y | b.p. | LCP    | TBT    | CLS   | JS       |')
    console.log('| ---------------- | ---- | ---- | ---- | ------ | ------ | ----- | -------- |')
    for (const r of rows) console.log(fmt(r.figures))
    console.log(
      `\nTargets: performance ≥ ${TARGETS.performance}, accessibility ${TARGETS.accessibility.toFixed(2)}, best practices ≥ ${TARGETS.bestPractices}, LCP ≤ ${TARGETS.lcpMs / 1000} s, JS ≤ ${TARGETS.publicJsKb} KB on / and /report. Reports: ${join(DIR, 'reports')}`,
    )
    let failed = 0
    for (const r of rows) {
      const m = misses(r.figures, r.spec)
      if (m.length) failed++
      if (m.length || r.figures.notes.length)
        console.log(
          `\n${r.spec.name}: ${m.length ? `MISSES ${m.join(', ')}` : 'meets the targets'}\n  ${r.figures.notes.join('\n  ')}`,
        )
    }
    return failed ? 1 : 0
  } finally {
    server?.close()
    await browser.close()
    if (db.startedHere) await db.stop()
  }
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(err)
    process.exit(1)
  },
)
