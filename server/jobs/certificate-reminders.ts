// The safety officers' certificate reminders, once a day (schedule.ts, CERTIFICATE_REMINDER_CRON):
// every certificate (the newest record per subject and kind) that has come within 30 days of its
// next due date, within 14 days, or to that date, is e-mailed to every active safety officer once
// per stage, with an in-app notice. certificate_reminders keeps what was sent (one row per
// certificate and stage, UNIQUE), so a second run, or a second process, sends nothing again.
// Days are counted on the clock of the client whose subject it is (platforms: the app's zone).
import type { Db } from '../db'
import type { Mailer } from '../mail/mailer'
import type { Config } from '../config'
import { localDay } from '../../shared/local-time'
import { reminderStage, type ReminderStage } from '../../shared/schemas/certificates'
import { daysUntil, latestCertificates } from '../services/queue/certificates'
import { subjectIds, subjectLabels, subjectPlaces } from '../services/certificate-subjects'
import { clientZones } from '../services/zones'
import { addNotices } from '../services/notices'
import { reminderMail, reminderTitle, type Reminder } from './certificate-reminders-mail'

/** The reminders that have come due at `now` and were not sent before. */
export async function dueReminders(db: Db, config: Pick<Config, 'APP_TIME_ZONE'>, now: Date) {
  const certs = (await latestCertificates(db)).filter((c) => c.result !== 'fail' && c.nextDue)
  // Only the subjects of these records are looked up, not every string of the estate.
  const only = subjectIds(certs)
  const [places, zones, labels] = await Promise.all([
    subjectPlaces(db, only),
    clientZones(db),
    subjectLabels(db, only),
  ])
  const sent = new Set(
    (await db('certificateReminders').select('certificateId', 'stage')).map(
      (r) => `${r.certificateId}:${r.stage}`,
    ),
  )
  const out: Reminder[] = []
  for (const c of certs) {
    const clientId = places.get(`${c.subjectType}:${c.subjectId}`)?.clientId
    const zone = (clientId && zones.get(clientId)) || config.APP_TIME_ZONE
    const daysLeft = daysUntil(localDay(now, zone), c.nextDue!)
    const stage: ReminderStage | null = reminderStage(daysLeft)
    if (!stage || sent.has(`${c.id}:${stage}`)) continue
    out.push({
      certificateId: c.id,
      kind: c.kind,
      stage,
      nextDue: c.nextDue!,
      daysLeft,
      label: labels.get(`${c.subjectType}:${c.subjectId}`) ?? `${c.subjectType} ${c.subjectId}`,
      reference: c.reference,
    })
  }
  return out.sort((a, b) => a.daysLeft - b.daysLeft || a.label.localeCompare(b.label))
}

/** Records, notifies and mails the reminders due now; answers what was sent. */
export async function sendCertificateReminders(db: Db, mailer: Mailer, config: Config, now = new Date()) {
  const officers: { id: number; email: string; name: string }[] = await db('users')
    .where({ role: 'safety', active: true })
    .orderBy('id')
    .select('id', 'email', 'name')
  // Claimed in one commit with the notices: a row already there (another process got it first)
  // makes this one skip that reminder.
  const claimed = await db.transaction(async (trx) => {
    const fresh: Reminder[] = []
    for (const r of await dueReminders(trx, config, now)) {
      const [n] = await trx.raw(
        'insert ignore into certificate_reminders (certificate_id, stage, next_due, sent_at, recipients) values (?, ?, ?, ?, ?)',
        [r.certificateId, r.stage, r.nextDue, now, officers.length],
      )
      if (Number((n as { affectedRows?: number }).affectedRows ?? 0) === 1) fresh.push(r)
    }
    if (fresh.length)
      await addNotices(
        trx,
        officers.map((o) => o.id),
        {
          kind: 'certificate_expiring',
          title: reminderTitle(fresh),
          body: fresh.map((r) => r.label).join('; '),
          link: '/certificates',
        },
      )
    return fresh
  })
  if (claimed.length) for (const o of officers) await mailer.send(reminderMail(config, o, claimed, now))
  const count = (s: ReminderStage) => claimed.filter((r) => r.stage === s).length
  return {
    reminders: claimed.length,
    recipients: claimed.length ? officers.length : 0,
    stages: { days_30: count('days_30'), days_14: count('days_14'), expired: count('expired') },
  }
}
