// Scheduled work inside the server process: the queue (and the forecasts it needs) every 10 minutes,
// and the managers' weekly digest on DIGEST_CRON in APP_TIME_ZONE. Every run takes the job's MariaDB
// named lock (run-job.ts), so several server processes still run each job once.
import { Cron } from 'croner'
import type { Db } from '../db'
import type { Mailer } from '../mail/mailer'
import { config as appConfig, type Config } from '../config'
import { logger } from '../logger'
import { runJob, runScheduled, type JobDeps } from './run-job'
import { startMailRetry } from './mail-retry'

export const QUEUE_REFRESH_MS = 10 * 60_000

/** A tick that never overlaps itself in this process and logs instead of throwing. */
function guarded(label: string, work: () => Promise<unknown>): () => Promise<void> {
  let running = false
  return async () => {
    if (running) return
    running = true
    try {
      const r = await work()
      logger.info({ result: r }, label)
    } catch (err) {
      logger.error({ err }, `${label}: failed`)
    } finally {
      running = false
    }
  }
}

export function startJobs(db: Db, mailer: Mailer, config: Config = appConfig): () => void {
  const stops: (() => void)[] = []
  const d: JobDeps = { db, mailer, config }
  const queueTick = guarded('queue refresh', () => runJob('queue-refresh', d))
  const timer = setInterval(queueTick, QUEUE_REFRESH_MS)
  timer.unref()
  stops.push(() => clearInterval(timer))
  void queueTick()
  // Mail whose sending failed is tried again every minute (backoff and claims: mail/outbox.ts).
  stops.push(startMailRetry(mailer))
  const digestTick = guarded('weekly digest', () => runScheduled('weekly-digest', d))
  const cron = new Cron(config.DIGEST_CRON, { timezone: config.APP_TIME_ZONE, unref: true }, digestTick)
  stops.push(() => cron.stop())
  return () => stops.forEach((stop) => stop())
}
