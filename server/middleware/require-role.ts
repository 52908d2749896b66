import type { RequestHandler } from 'express'
import type { Role } from '../../shared/roles'
import { forbidden, unauthenticated } from '../errors'

export function requireRoles(allowed: readonly Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthenticated())
    if (!allowed.includes(req.user.role)) return next(forbidden())
    next()
  }
}
