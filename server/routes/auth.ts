import type { Request, Response } from 'express'
import jwt from 'jsonwebtoken'
import { z } from 'zod'
import {
  FORGOT_PASSWORD_MESSAGE,
  acceptInviteBody,
  changePasswordBody,
  forgotPasswordBody,
  forgotPasswordResponse,
  meResponse,
  resetPasswordBody,
  publicUser,
  sessionResponse,
  signInBody,
} from '../../shared/schemas/auth'
import { everyone } from '../../shared/roles'
import { defineRoute, type RouteDef } from '../route-table'
import type { AppDeps } from '../deps'
import { HttpError, badRequest } from '../errors'
import { SESSION_COOKIE } from '../middleware/authenticate'
import {
  acceptInvite,
  checkPassword,
  recordSignIn,
  revokeSessions,
  setPassword,
  verifyCredentials,
  type SessionUser,
} from '../services/users'
import { audited } from '../services/audit'
import { signInSucceeded, startSignInAttempt } from '../services/rate-limits'
import { checkNewPassword } from '../services/password-policy'
import { requestPasswordReset, resetPassword } from '../services/password-reset'

// Secure whenever the request arrived over https: directly, or through a proxy trusted by TRUST_PROXY.
const cookieOptions = (req: Request) => ({
  httpOnly: true,
  sameSite: 'lax' as const,
  secure: req.secure,
  path: '/',
})

/** A token carrying the user's current token version, in the body and as the session cookie. */
function startSession(deps: AppDeps, req: Request, res: Response, user: SessionUser) {
  const hours = deps.config.SESSION_HOURS
  const token = jwt.sign({ role: user.role, ver: user.tokenVersion }, deps.jwtSecret, {
    subject: String(user.id),
    expiresIn: `${hours}h`,
    algorithm: 'HS256',
  })
  res.cookie(SESSION_COOKIE, token, { ...cookieOptions(req), maxAge: hours * 3_600_000 })
  const { id, name, email, role, crewId } = user
  return { user: { id, name, email, role, crewId }, token }
}

const entry = (req: Request, userId: number, action: string) => ({
  userId,
  action,
  entity: 'user',
  entityId: userId,
  requestId: String(req.id),
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
    handler: async ({ body, res, deps, req }) => {
      await startSignInAttempt(deps.db, body.email, req.ip, res)
      const user = await verifyCredentials(deps.db, body.email, body.password)
      if (!user) throw new HttpError(401, 'invalid_credentials', 'E-mail or password is not right.')
      await signInSucceeded(deps.db, body.email, req.ip)
      await audited(
        deps.db,
        (trx) => recordSignIn(trx, user.id),
        () => entry(req, user.id, 'sign_in'),
      )
      return startSession(deps, req, res, user)
    },
  }),
  defineRoute({
    method: 'get',
    path: '/auth/me',
    access: everyone,
    tag: 'auth',
    summary: 'The signed-in user',
    response: meResponse,
    handler: ({ user }) => ({ user }),
  }),
  // The client's start-up check (issue 14): "not signed in" is an answer, not an error, so the
  // sign-in page loads without a 401 in the console. /auth/me keeps its 401 for API callers.
  defineRoute({
    method: 'get',
    path: '/auth/session',
    access: 'public',
    tag: 'auth',
    summary: 'The signed-in user, or null when there is no valid session (never 401)',
    response: z.object({ user: publicUser.nullable() }),
    handler: ({ req }) => ({ user: req.user ?? null }),
  }),
  defineRoute({
    method: 'post',
    path: '/auth/sign-out',
    access: 'public',
    tag: 'auth',
    summary: 'End the session: every token of the signed-in user stops working',
    handler: async ({ req, res, deps }) => {
      const user = req.user
      if (user) {
        await audited(
          deps.db,
          (trx) => revokeSessions(trx, user.id),
          () => entry(req, user.id, 'sign_out'),
        )
      }
      res.clearCookie(SESSION_COOKIE, cookieOptions(req))
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/password',
    access: everyone,
    tag: 'auth',
    summary: 'Change the password; other sessions end and this device gets a fresh one',
    body: changePasswordBody,
    response: sessionResponse,
    handler: async ({ body, user, req, res, deps }) => {
      // Guessing the current password from a stolen session meets the sign-in limit.
      await startSignInAttempt(deps.db, user.email, req.ip, res)
      await checkPassword(deps.db, user.id, body.currentPassword)
      await signInSucceeded(deps.db, user.email, req.ip)
      if (body.newPassword === body.currentPassword)
        throw badRequest('password_unchanged', 'Choose a new password different from the current one.')
      checkNewPassword(body.newPassword, user.email)
      const session = await audited(
        deps.db,
        (trx) => setPassword(trx, user.id, body.newPassword),
        () => entry(req, user.id, 'password_change'),
      )
      return startSession(deps, req, res, session)
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
    handler: async ({ body, req, res, deps }) => {
      const user = await audited(
        deps.db,
        (trx) => acceptInvite(trx, body.token, body.password),
        (u) => entry(req, u.id, 'accept_invite'),
      )
      return startSession(deps, req, res, user)
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/forgot-password',
    access: 'public',
    tag: 'auth',
    summary:
      'E-mail a one-time link to choose a new password (same answer whether or not the account exists)',
    body: forgotPasswordBody,
    response: forgotPasswordResponse,
    status: 202,
    handler: async ({ body, req, res, deps }) => {
      await requestPasswordReset(deps, body.email, req.ip, res)
      return { message: FORGOT_PASSWORD_MESSAGE }
    },
  }),
  defineRoute({
    method: 'post',
    path: '/auth/reset-password',
    access: 'public',
    tag: 'auth',
    summary: 'Choose a new password from a reset link; every other session ends',
    body: resetPasswordBody,
    response: sessionResponse,
    handler: async ({ body, req, res, deps }) => {
      const user = await audited(
        deps.db,
        (trx) => resetPassword(trx, body.token, body.password),
        (u) => entry(req, u.id, 'password_reset'),
      )
      return startSession(deps, req, res, user)
    },
  }),
]
