// Scheduled work inside the server process: the queue (and the forecasts it needs) every 10 minutes,
// the managers' weekly digest on DIGEST_CRON and the safety officers' certificate reminders daily at
// 06:30, both in APP_TIME_ZONE. Every run takes the job's MariaDB
// named lock (run-job.ts), so several server processes still run each job once.
import { Cron } from 'croner'
import type { Db } from '../db'
import type { Mailer } from '../mail/mailer'
import { config as appConfig, type Config } from '../config'
import { logger } from '../logger'
import { runJob, runScheduled, type JobDeps } from './run-job'
import { startMailRetry } from './mail-retry'
import { onRefreshSoon } from '../services/queue/refresh-soon'

export const QUEUE_REFRESH_MS = 10 * 60_000
/** The safety officers' certificate reminders: every day at 06:30 in APP_TIME_ZONE (croner, seconds first). */
export const CERTIFICATE_REMINDER_CRON = '0 30 6 * * *'

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
  // A visit asks for a small refresh a few seconds later (services/queue/refresh-soon.ts).
  onRefreshSoon(queueTick)
  stops.push(() => onRefreshSoon(null))
  void queueTick()
  // Mail whose sending failed is tried again every minute (backoff and claims: mail/outbox.ts).
  stops.push(startMailRetry(mailer))
  const digestTick = guarded('weekly digest', () => runScheduled('weekly-digest', d))
  const cron = new Cron(config.DIGEST_CRON, { timezone: config.APP_TIME_ZONE, unref: true }, digestTick)
  stops.push(() => cron.stop())
  const reminderTick = guarded('certificate reminders', () => runScheduled('certificate-reminders', d))
  const reminders = new Cron(
    CERTIFICATE_REMINDER_CRON,
    { timezone: config.APP_TIME_ZONE, unref: true },
    reminderTick,
  )
  stops.push(() => reminders.stop())
  return () => stops.forEach((stop) => stop())
}
