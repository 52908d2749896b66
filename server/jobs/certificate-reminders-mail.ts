// The certificate reminder's words: one message per safety officer per run, grouped by stage, dates
// as calendar days (a certificate falls due on a day, counted on its client's clock).
import type { Config } from '../config'
import type { MailMessage } from '../mail/mailer'
import { renderMail } from '../mail/templates'
import { publicLink } from '../public-url'
import { plural } from '../../shared/number-format'
import { formatDay, formatInZone } from '../../shared/local-time'
import type { ReminderStage } from '../../shared/schemas/certificates'
import { certificateKindLabel } from '../../shared/vocab/certificates'

export interface Reminder {
  certificateId: number
  kind: keyof typeof certificateKindLabel
  stage: ReminderStage
  nextDue: string
  daysLeft: number
  label: string
  reference: string | null
}

const HEADINGS: Record<ReminderStage, string> = {
  expired: 'Expired (do not use or rely on these until a new test passes)',
  days_14: 'Due within 14 days',
  days_30: 'Due within 30 days',
}

/** One line for the subject and the notice, e.g. "Certificates: 1 expired, 2 due within 30 days". */
export function reminderTitle(list: Reminder[]): string {
  const n = (s: ReminderStage) => list.filter((r) => r.stage === s).length
  const parts = [
    n('expired') && `${n('expired')} expired`,
    n('days_14') && `${n('days_14')} due within 14 days`,
    n('days_30') && `${n('days_30')} due within 30 days`,
  ].filter(Boolean)
  return `Certificates: ${parts.join(', ')}`
}

export function reminderMail(
  config: Config,
  to: { email: string; name: string },
  list: Reminder[],
  now: Date,
): MailMessage {
  const locale = config.APP_LOCALE
  const line = (r: Reminder) => {
    const what = certificateKindLabel[r.kind] ?? r.kind
    const when =
      r.daysLeft < 0
        ? `expired ${formatDay(r.nextDue, locale)}`
        : r.daysLeft === 0
          ? `expires today, ${formatDay(r.nextDue, locale)}`
          : `due ${formatDay(r.nextDue, locale)} (${plural(r.daysLeft, 'day')})`
    return `${r.label}: ${what} ${when}${r.reference ? `, ref. ${r.reference}` : ''}`
  }
  const groups = (['expired', 'days_14', 'days_30'] as const)
    .map((stage) => ({ heading: HEADINGS[stage], lines: list.filter((r) => r.stage === stage).map(line) }))
    .filter((g) => g.lines.length)
  const subject = `${reminderTitle(list)} (${formatInZone(now, config.APP_TIME_ZONE, locale, 'date')})`
  const parts = renderMail(config, 'certificate-reminders', subject, {
    name: to.name,
    groups,
    link: publicLink(config, '/certificates'),
  })
  return { to: to.email, ...parts, topic: 'certificate_reminder' }
}
