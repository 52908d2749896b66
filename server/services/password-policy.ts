// What a new password must be (reset, change, invitation): long enough (shared/vocab/auth.ts
// NEW_PASSWORD_MIN) and not one of the most common passwords nor built from the account's own words
// (NIST SP 800-63B §5.1.1.2: compare against commonly used values and context-specific words).
import { readFileSync } from 'node:fs'
import { badRequest } from '../errors'
import { NEW_PASSWORD_MIN } from '../../shared/vocab/auth'

const common = new Set(
  readFileSync(new URL('./common-passwords.txt', import.meta.url), 'utf8')
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l && !l.startsWith('#')),
)

const field = (message: string) => ({ fields: [{ path: 'body.password', message }] })

/** Throws 400 password_too_short or password_too_common; `email` is the account's. */
export function checkNewPassword(password: string, email?: string): void {
  if (password.length < NEW_PASSWORD_MIN) {
    const m = `Use at least ${NEW_PASSWORD_MIN} characters.`
    throw badRequest('password_too_short', m, field(m))
  }
  const p = password.trim().toLowerCase()
  const local = email?.toLowerCase().split('@')[0]
  if (common.has(p)) {
    const m = 'That password is on the list of the most common ones. Choose another.'
    throw badRequest('password_too_common', m, field(m))
  }
  if (p.includes('lampwright') || (email && (p === email.toLowerCase() || p === local))) {
    const m = 'Leave the app’s name and your e-mail address out of the password.'
    throw badRequest('password_too_common', m, field(m))
  }
}
