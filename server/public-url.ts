// The one place a link that leaves the server is built (invitations, password resets, report status,
// runs, reminders, digests): PUBLIC_URL when it is set, so a link works from a mail client and not only
// on the machine that sent it; this server's own loopback address only when it is not.
import type { Config } from './config'

/** The base of every outside link, without a trailing slash. */
export function publicBaseUrl(config: Pick<Config, 'PUBLIC_URL' | 'PORT'>): string {
  const set = config.PUBLIC_URL?.trim()
  return (set || `http://localhost:${config.PORT}`).replace(/\/+$/, '')
}

/** A link to `path` of the app (leading slash), with optional query values encoded. */
export function publicLink(
  config: Pick<Config, 'PUBLIC_URL' | 'PORT'>,
  path: string,
  query: Record<string, string> = {},
): string {
  const q = new URLSearchParams(query).toString()
  return `${publicBaseUrl(config)}${path}${q ? `?${q}` : ''}`
}
