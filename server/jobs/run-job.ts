// The jobs an admin may run at once (POST /admin/jobs/{name}/run) and the schedule runs on its
// clock: each behind a MariaDB named lock, so one process runs it at a time.
import type { Db } from '../db'
import type { Mailer } from '../mail/mailer'
import type { Config } from '../config'
import { withNamedLock, type LockedRun } from './named-lock'
import { refreshQueue } from './refresh-queue'
import { sendWeeklyDigest } from './weekly-digest'
import { sendCertificateReminders } from './certificate-reminders'

export const jobNames = ['weekly-digest', 'queue-refresh', 'certificate-reminders'] as const
export type JobName = (typeof jobNames)[number]

export interface JobDeps {
  db: Db
  mailer: Mailer
  config: Config
}

const jobs: Record<JobName, (d: JobDeps, now: Date) => Promise<unknown>> = {
  'weekly-digest': (d, now) => sendWeeklyDigest(d.db, d.mailer, d.config, now),
  'queue-refresh': (d, now) => refreshQueue(d.db, now),
  'certificate-reminders': (d, now) => sendCertificateReminders(d.db, d.mailer, d.config, now),
}

export const isJobName = (name: string): name is JobName => (jobNames as readonly string[]).includes(name)

/** Runs the job now unless another process is running it (`{ ran: false }`). */
export function runJob(name: JobName, d: JobDeps, now = new Date()): Promise<LockedRun<unknown>> {
  return withNamedLock(d.db, name, () => jobs[name](d, now))
}

const slotKey = (name: JobName) => `jobs.${name}.slot`

/**
 * A scheduled run: every process's clock fires at the same minute, and the first to take the lock
 * records the minute, so the others (even after the lock is free again) skip it.
 */
export function runScheduled(name: JobName, d: JobDeps, now = new Date()): Promise<LockedRun<unknown>> {
  const slot = new Date(Math.floor(now.getTime() / 60_000) * 60_000).toISOString()
  return withNamedLock(d.db, name, async () => {
    const row = await d
      .db('settings')
      .where({ key: slotKey(name) })
      .first('value')
    const last = typeof row?.value === 'string' ? safeParse(row.value) : row?.value
    if (last === slot) return { skipped: 'already run for this time' }
    await d
      .db('settings')
      .insert({ key: slotKey(name), value: JSON.stringify(slot) })
      .onConflict('key')
      .merge()
    return jobs[name](d, now)
  })
}

function safeParse(v: string): unknown {
  try {
    return JSON.parse(v)
  } catch {
    return v
  }
}
