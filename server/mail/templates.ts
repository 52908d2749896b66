import type { Config } from '../config'
import type { MailMessage } from './mailer'
import { roleLabel, type Role } from '../../shared/roles'

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)

export function baseUrl(config: Config): string {
  return config.PUBLIC_URL ?? `http://localhost:${config.PORT}`
}

export function inviteMail(
  config: Config,
  user: { name: string; email: string; role: Role },
  token: string,
  by: string,
): MailMessage {
  const link = `${baseUrl(config)}/accept-invite?token=${encodeURIComponent(token)}`
  const text = `Hello ${user.name},\n\n${by} has invited you to Lampwright as ${roleLabel[user.role]}.\nSet your password here (the link works for 7 days):\n${link}\n`
  const html = `<p>Hello ${esc(user.name)},</p><p>${esc(by)} has invited you to Lampwright as ${esc(roleLabel[user.role])}.</p><p><a href="${esc(link)}">Set your password</a> (the link works for 7 days).</p>`
  return { to: user.email, subject: 'Your Lampwright account', text, html, topic: 'invite' }
}
