// The weekly digest's words, plain text and HTML. Kept here until the mail templates move to
// server/mail/views (eta); the figures come from weekly-digest.ts.
import type { Config } from '../config'
import type { MailMessage } from '../mail/mailer'
import { formatDay, formatInZone } from '../../shared/local-time'
import { certificateKindLabel } from '../../shared/vocab/certificates'
import type { Digest, DigestClient } from './weekly-digest'
import { publicBaseUrl } from '../public-url'
import { plural } from '../../shared/number-format'

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)

function clientLine(c: Omit<DigestClient, 'id' | 'name'>, locale: string): string {
  const hours = c.darkHours.toLocaleString(locale, { minimumFractionDigits: 1, maximumFractionDigits: 1 })
  return [
    `${plural(c.overdueNow, 'fault')} past contract time now`,
    `${hours} dark hours`,
    `${plural(c.faultsFound, 'fault')} found`,
    `${c.faultsFixed} fixed`,
    `${plural(c.lampsReplaced, 'lamp')} replaced`,
  ].join(' · ')
}

export function digestMail(config: Config, to: { email: string; name: string }, d: Digest): MailMessage {
  const zone = config.APP_TIME_ZONE
  const locale = config.APP_LOCALE
  const when = (at: Date) => formatInZone(at, zone, locale, 'dateTime')
  const base = publicBaseUrl(config)
  const subject = `Lampwright weekly digest: week to ${formatInZone(d.to, zone, locale, 'date')}`
  const busy = d.clients.filter(
    (c) => c.overdueNow || c.darkHours || c.faultsFound || c.faultsFixed || c.lampsReplaced,
  )
  const certs = d.certificates
  const certLines = certs.soon.map(
    (c) =>
      `${c.label}: ${certificateKindLabel[c.kind as keyof typeof certificateKindLabel] ?? c.kind} due ${formatDay(c.nextDue, locale)}`,
  )
  const certSummary = `${plural(certs.overdue, 'certificate')} past due, ${plural(certs.failed, 'failed test')} on record.`
  const intro = `Hello ${to.name},\n\nThe week from ${when(d.from)} to ${when(d.to)} (${zone}).`
  const text = [
    intro,
    '',
    `All clients: ${clientLine(d.totals, locale)}.`,
    '',
    'By client:',
    ...(busy.length ? busy.map((c) => `- ${c.name}: ${clientLine(c, locale)}`) : ['- Nothing to report.']),
    '',
    `Certificates: ${certSummary}`,
    ...(certLines.length
      ? ['Falling due in the next 30 days:', ...certLines.map((l) => `- ${l}`)]
      : ['None falls due in the next 30 days.']),
    '',
    'Dark hours count from the fault being opened to it being closed, within the week.',
    `Overdue work: ${base}/overdue`,
    `Certificates: ${base}/certificates`,
    '',
  ].join('\n')
  const li = (s: string) => `<li>${esc(s)}</li>`
  const html = [
    `<p>Hello ${esc(to.name)},</p>`,
    `<p>The week from ${esc(when(d.from))} to ${esc(when(d.to))} (${esc(zone)}).</p>`,
    `<p><strong>All clients:</strong> ${esc(clientLine(d.totals, locale))}.</p>`,
    '<h3>By client</h3>',
    `<ul>${busy.length ? busy.map((c) => li(`${c.name}: ${clientLine(c, locale)}`)).join('') : li('Nothing to report.')}</ul>`,
    '<h3>Certificates</h3>',
    `<p>${esc(certSummary)}</p>`,
    certLines.length
      ? `<p>Falling due in the next 30 days:</p><ul>${certLines.map(li).join('')}</ul>`
      : '<p>None falls due in the next 30 days.</p>',
    '<p>Dark hours count from the fault being opened to it being closed, within the week.</p>',
    `<p><a href="${esc(base)}/overdue">Overdue work</a> · <a href="${esc(base)}/certificates">Certificates</a></p>`,
  ].join('\n')
  return { to: to.email, subject, text, html, topic: 'weekly_digest' }
}
