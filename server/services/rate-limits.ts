// Request limits counted in MariaDB (table rate_limits, made by a migration), so they hold across
// restarts and across every app process on the same database.
import type { RequestHandler, Response } from 'express'
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible'
import type { Db } from '../db'
import { HttpError } from '../errors'

export interface Limit {
  /** Key prefix in the table; one per limit. */
  name: string
  points: number
  seconds: number
  message: string
}

export const LIMITS = {
  // OWASP Authentication Cheat Sheet: throttle failed sign-ins per account; ten per 15 minutes as before.
  signInEmail: {
    name: 'sign-in-email',
    points: 10,
    seconds: 15 * 60,
    message: 'Too many failed sign-ins for this account. Wait and try again.',
  },
  // One address trying many accounts (common practice, no source): more room for a shared depot NAT.
  signInAddress: {
    name: 'sign-in-address',
    points: 30,
    seconds: 15 * 60,
    message: 'Too many failed sign-ins from your network. Wait and try again.',
  },
  report: {
    name: 'report',
    points: 10,
    seconds: 60 * 60,
    message: 'Thank you — we have several reports from you already. Try again later.',
  },
  // References are short; this keeps anyone from walking through them (common practice, no source).
  statusLookup: {
    name: 'report-status',
    points: 60,
    seconds: 15 * 60,
    message: 'Too many look-ups from your address. Try again later.',
  },
} satisfies Record<string, Limit>

const limiters = new WeakMap<Db, Map<string, RateLimiterMySQL>>()

function limiterFor(db: Db, limit: Limit): RateLimiterMySQL {
  let byName = limiters.get(db)
  if (!byName) limiters.set(db, (byName = new Map()))
  let limiter = byName.get(limit.name)
  if (!limiter) {
    const connection = db.client.config.connection as { database?: string }
    limiter = new RateLimiterMySQL({
      storeClient: db,
      storeType: 'knex',
      dbName: connection.database,
      tableName: 'rate_limits',
      tableCreated: true,
      keyPrefix: limit.name,
      points: limit.points,
      duration: limit.seconds,
    })
    byName.set(limit.name, limiter)
  }
  return limiter
}

/** E-mail as the account key: the address a person types, whatever the spaces and capitals. */
export const normaliseEmail = (email: string): string => email.trim().toLowerCase()

/** Counts one attempt; over the limit it sets Retry-After and throws 429 rate_limited. */
export async function consume(db: Db, limit: Limit, key: string, res: Response): Promise<void> {
  try {
    await limiterFor(db, limit).consume(key)
  } catch (err) {
    if (!(err instanceof RateLimiterRes)) throw err
    const seconds = Math.max(1, Math.ceil(err.msBeforeNext / 1000))
    res.setHeader('Retry-After', String(seconds))
    throw new HttpError(429, 'rate_limited', limit.message, { retryAfterSeconds: seconds })
  }
}

/** Middleware: one point per request from the client's address (req.ip, which honours TRUST_PROXY). */
export function limitByAddress(db: Db, limit: Limit): RequestHandler {
  return async (req, res, next) => {
    await consume(db, limit, req.ip ?? 'unknown', res)
    next()
  }
}

/**
 * Every sign-in attempt is counted before the password is checked, on the account and on the
 * address, so parallel guesses cannot slip past the count; a success gives its point back.
 */
export async function startSignInAttempt(db: Db, email: string, ip: string | undefined, res: Response) {
  await consume(db, LIMITS.signInAddress, ip ?? 'unknown', res)
  await consume(db, LIMITS.signInEmail, normaliseEmail(email), res)
}

export async function signInSucceeded(db: Db, email: string, ip: string | undefined): Promise<void> {
  await limiterFor(db, LIMITS.signInEmail).delete(normaliseEmail(email))
  await limiterFor(db, LIMITS.signInAddress).reward(ip ?? 'unknown', 1)
}
