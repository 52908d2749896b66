// The one template module for e-mail: every message is an eta view in ./views with an HTML part
// (<name>.html.eta, inside layout.html.eta, values escaped) and a plain-text part (<name>.txt.eta).
// Dates are written in the zone of whoever the mail is about: a client's zone, else the app's.
import { fileURLToPath } from 'node:url'
import { Eta } from 'eta'
import type { Config } from '../config'
import type { MailMessage } from './mailer'
import { roleLabel, type Role } from '../../shared/roles'
import { formatInZone } from '../../shared/local-time'
import { publicBaseUrl, publicLink } from '../public-url'

const views = fileURLToPath(new URL('./views', import.meta.url))
const htmlViews = new Eta({ views, cache: true })
const textViews = new Eta({ views, cache: true, autoEscape: false, autoTrim: false })

/** The zone and locale dates are written in: `zone` (a client's, from services/zones.ts) or the app's. */
export function mailClock(config: Config, zone?: string | null) {
  const tz = zone || config.APP_TIME_ZONE
  return {
    zone: tz,
    locale: config.APP_LOCALE,
    /** e.g. "Wed 2 Dec, 17:45 (Europe/London time)". */
    dateTime: (at: Date) => `${formatInZone(at, tz, config.APP_LOCALE, 'dateTime')} (${tz} time)`,
  }
}

/** Renders `view` into both parts; `data` reaches the views as `it`. */
export function renderMail(
  config: Config,
  view: string,
  subject: string,
  data: Record<string, unknown>,
): { subject: string; text: string; html: string } {
  const it = { ...data, subject, appUrl: publicBaseUrl(config), lang: config.APP_LOCALE.split('-')[0] }
  return {
    subject,
    text: `${textViews.render(`./${view}.txt.eta`, it).trimEnd()}\n`,
    html: htmlViews.render(`./${view}.html.eta`, it),
  }
}

export function inviteMail(
  config: Config,
  user: { name: string; email: string; role: Role },
  token: string,
  by: string,
  expiresAt: Date = new Date(Date.now() + 7 * 86_400_000),
): MailMessage {
  const link = publicLink(config, '/accept-invite', { token })
  const parts = renderMail(config, 'invite', 'Your Lampwright account', {
    name: user.name,
    by,
    roleLabel: roleLabel[user.role],
    link,
    expires: mailClock(config).dateTime(expiresAt),
  })
  return { to: user.email, ...parts, topic: 'invite' }
}

/** The one-time reset link; users belong to no client, so the app's zone. */
export function passwordResetMail(
  config: Config,
  user: { name: string; email: string },
  token: string,
  expiresAt: Date,
): MailMessage {
  const link = publicLink(config, '/reset-password', { token })
  const parts = renderMail(config, 'password-reset', 'Reset your Lampwright password', {
    name: user.name,
    link,
    expires: mailClock(config).dateTime(expiresAt),
  })
  return { to: user.email, ...parts, topic: 'password_reset' }
}
