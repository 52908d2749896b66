// Cross-site request forgery guard for the cookie session. A browser attaches the session cookie to a
// form or fetch sent from any site; it also states where the request came from (Origin, and
// Sec-Fetch-Site in current browsers), which another site cannot forge. Mounted before the body
// parsers and multer, so a refused write is not read at all.
import type { Request, RequestHandler } from 'express'
import type { Config } from '../config'
import { HttpError } from '../errors'
import { SESSION_COOKIE } from './authenticate'

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

const crossSite = () =>
  new HttpError(
    403,
    'cross_site_request',
    'This change was sent from another site and was refused. Open the app itself and try again.',
  )

function originOf(url: string): string | null {
  try {
    return new URL(url).origin
  } catch {
    return null
  }
}

/** PUBLIC_URL's origin when set, else the origin this request was addressed to. */
function ownOrigin(config: Pick<Config, 'PUBLIC_URL'>, req: Request): string | null {
  if (config.PUBLIC_URL) return originOf(config.PUBLIC_URL)
  const host = req.get('host')
  return host ? originOf(`${req.protocol}://${host}`) : null
}

export function sameOrigin(config: Pick<Config, 'PUBLIC_URL'>): RequestHandler {
  return (req, _res, next) => {
    if (!UNSAFE.has(req.method)) return next()
    // A Bearer token is sent by code that holds it; a browser never adds it on another site's behalf,
    // and authenticate then ignores the cookie.
    if (req.headers.authorization?.startsWith('Bearer ')) return next()
    const fetchSite = req.headers['sec-fetch-site']
    const origin = req.headers.origin
    if (fetchSite === 'same-origin') return next()
    if (origin !== undefined && origin === ownOrigin(config, req)) return next()
    if (req.cookies?.[SESSION_COOKIE]) return next(crossSite())
    // Without a session cookie there is no session to abuse, and scripts and tools (no Origin) may
    // call public writes. A browser that says the request comes from elsewhere is still refused:
    // that stops another site signing a visitor in to an account of its choosing.
    if (origin !== undefined || (fetchSite !== undefined && fetchSite !== 'none')) return next(crossSite())
    next()
  }
}
