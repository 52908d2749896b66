import type { RequestHandler } from 'express'
import jwt from 'jsonwebtoken'
import type { AppDeps } from '../deps'
import { findActiveUser } from '../services/users'

export const SESSION_COOKIE = 'lw_session'

function tokenFrom(header: string | undefined, cookie: string | undefined): string | null {
  if (header?.startsWith('Bearer ')) return header.slice(7).trim()
  return cookie ?? null
}

/** Attaches req.user when a valid session token arrives by cookie or Bearer header. */
export function authenticate(deps: AppDeps): RequestHandler {
  return async (req, _res, next) => {
    const token = tokenFrom(req.headers.authorization, req.cookies?.[SESSION_COOKIE])
    if (!token) return next()
    let sub: number
    try {
      const payload = jwt.verify(token, deps.jwtSecret, { algorithms: ['HS256'] }) as jwt.JwtPayload
      sub = Number(payload.sub)
    } catch {
      return next()
    }
    const user = await findActiveUser(deps.db, sub)
    if (user) req.user = user
    next()
  }
}
