import type { Response } from 'express'
import jwt from 'jsonwebtoken'
import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import { acceptInviteBody, meResponse, sessionResponse, signInBody } from '../../shared/schemas/auth'
import { roles } from '../../shared/roles'
import { defineRoute, type RouteDef } from '../route-table'
import type { AppDeps } from '../deps'
import { HttpError } from '../errors'
import { SESSION_COOKIE } from '../middleware/authenticate'
import { acceptInvite, verifyCredentials } from '../services/users'
import { audit } from '../services/audit'

type SessionUser = {
  id: number
  name: string
  email: string
  role: (typeof roles)[number]
  crewId: number | null
}

function startSession(deps: AppDeps, res: Response, user: SessionUser) {
  const hours = deps.config.SESSION_HOURS
  const token = jwt.sign({ role: user.role }, deps.jwtSecret, {
    subject: String(user.id),
    expiresIn: `${hours}h`,
    algorithm: 'HS256',
  })
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: deps.config.NODE_ENV === 'production' && deps.config.PUBLIC_URL?.startsWith('https:'),
    maxAge: hours * 3_600_000,
    path: '/',
  })
  return { user, token }
}

// Ten failed attempts per address and e-mail in 15 minutes, then a pause (OWASP authentication guidance).
const signInLimiter = () =>
  rateLimit({
    windowMs: 15 * 60_000,
    limit: 10,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '').toLowerCase()}`,
    handler: (_req, _res, next) =>
      next(new HttpError(429, 'rate_limited', 'Too many failed sign-ins. Wait 15 minutes and try again.')),
  })

export const authRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/auth/sign-in',
    access: 'public',
    tag: 'auth',
    summary: 'Sign in with e-mail and password',
    body: signInBody,
    response: sessionResponse,
    before: () => [signInLimiter()],
    handler: async ({ body, res, deps, req }) => {
      const user = await verifyCredentials(deps.db, body.email, body.password)
      if (!user) throw new HttpError(401, 'invalid_credentials', 'E-mail or password is not right.')
      await audit(deps.db, {
        userId: user.id,
        action: 'sign_in',
        entity: 'user',
        entityId: user.id,
        requestId: String(req.id),
      })
      return startSession(deps, res, user)
    },
  }),
  defineRoute({
    method: 'get',
    path: '/auth/me',
    access: roles,
    tag: 'auth',
    summary: 'The signed-in user',
    response: meResponse,
    handler: ({ user }) => ({ user }),
  }),
  defineRoute({
    method: 'post',
    path: '/auth/sign-out',
    access: 'public',
    tag: 'auth',
    summary: 'End the session',
    handler: ({ res }) => {
      res.clearCookie(SESSION_COOKIE, { path: '/' })
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/accept-invite',
    access: 'public',
    tag: 'auth',
    summary: 'Set a password from an invitation',
    body: acceptInviteBody,
    response: sessionResponse,
    handler: async ({ body, res, deps }) =>
      startSession(deps, res, await acceptInvite(deps.db, body.token, body.password)),
  }),
]
