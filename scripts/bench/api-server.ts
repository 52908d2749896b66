// For scripts/bench/api.ts: npm start's own start script (scripts/start.ts --api-only) against the
// bench database, so the API runs as WORKERS processes under node:cluster exactly as in production,
// and a wait for the full queue refresh every process starts with (it would otherwise share the CPU
// with the measured requests).
import { join, resolve } from 'node:path'
import { setTimeout as sleep } from 'node:timers/promises'
import { runScript, type Run } from '../run-script'
import type { BenchDatabase } from './large-estate'

export interface BenchServer {
  base: string
  /** Seconds the start-up queue refresh (forecasts of every lit string) held its lock; null if not seen. */
  startupRefreshSeconds: number | null
  stop(): Promise<void>
}

/** The named lock server/jobs/named-lock.ts takes for the queue refresh, in use right now? */
async function refreshRunning(db: BenchDatabase): Promise<boolean> {
  const [rows] = (await db.knex.raw('select is_used_lock(concat(left(database(), 20), ?)) as who', [
    ':lw-job:queue-refresh',
  ])) as unknown as [{ who: number | null }[]]
  return rows[0]?.who != null
}

/** Waits until the start-up refresh has taken its lock and let it go (or never took it within 10 s). */
async function waitForStartupRefresh(db: BenchDatabase, limitMs = 15 * 60_000): Promise<number | null> {
  const t0 = Date.now()
  let seenAt: number | null = null
  for (;;) {
    const running = await refreshRunning(db)
    if (running && seenAt === null) seenAt = Date.now()
    if (!running && seenAt !== null) return (Date.now() - t0) / 1000
    if (!running && Date.now() - t0 > 10_000) return null
    if (Date.now() - t0 > limitMs) throw new Error('the start-up queue refresh did not finish in 15 minutes')
    await sleep(250)
  }
}

export async function startBenchServer(db: BenchDatabase, workers?: string): Promise<BenchServer> {
  const dir = resolve(db.dir)
  const run: Run = runScript(
    'scripts/start.ts',
    {
      DATABASE_URL: db.url,
      DEMO_MODE: 'true',
      DATA_DIR: join(dir, 'app'),
      UPLOAD_DIR: join(dir, 'uploads'),
      // Every request logged as in production (run-script's default is warn), to a file, not the pipe;
      // BENCH_LOG_LEVEL=warn measures without the request lines, as runs before 2026-12-03 did.
      LOG_LEVEL: process.env.BENCH_LOG_LEVEL ?? 'info',
      LOG_FILE: join(dir, 'requests.log'),
      ...(workers ? { WORKERS: workers } : {}),
    },
    ['--api-only'],
  )
  try {
    const port = await run.ready
    process.stdout.write('Waiting for the start-up queue refresh over every string... ')
    const startupRefreshSeconds = await waitForStartupRefresh(db)
    console.log(startupRefreshSeconds === null ? 'not seen.' : `${startupRefreshSeconds.toFixed(1)} s.`)
    return {
      base: `http://127.0.0.1:${port}/api/v1`,
      startupRefreshSeconds,
      async stop() {
        await run.stop()
      },
    }
  } catch (err) {
    await run.stop()
    throw new Error(`the API did not start:\n${run.output()}`, { cause: err })
  }
}
