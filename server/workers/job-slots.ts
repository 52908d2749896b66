// Fair use of the worker pool: each user may have a few jobs running or waiting at once, and the
// pool's waiting line is bounded, so one user (or a burst) cannot queue work for everyone else.
import type { Response } from 'express'
import { HttpError } from '../errors'
import { maxQueued, queuedJobs } from './pool'

/** Jobs one user may have running or waiting at a time. */
export const MAX_JOBS_PER_USER = 2

// Most jobs end within the default 1 s tour limit or a forecast's second: a short wait is enough.
const RETRY_AFTER_S = 2

const running = new Map<number, number>()

function retryLater(res: Response | undefined, status: number, code: string, message: string): HttpError {
  res?.setHeader('Retry-After', String(RETRY_AFTER_S))
  return new HttpError(status, code, message, { retryAfterSeconds: RETRY_AFTER_S })
}

/** Takes one of the user's job slots (429 `too_many_jobs` when none is free) and checks the pool's
 * waiting line (503 `busy` when full). Returns the release, to call exactly once when the job ends. */
export function takeJobSlot(userId: number | undefined, res?: Response): () => void {
  if (userId !== undefined && (running.get(userId) ?? 0) >= MAX_JOBS_PER_USER) {
    throw retryLater(
      res,
      429,
      'too_many_jobs',
      `You already have ${MAX_JOBS_PER_USER} computations running; wait for one to finish.`,
    )
  }
  if (queuedJobs() >= maxQueued()) {
    throw retryLater(res, 503, 'busy', 'The server is busy with other computations; try again shortly.')
  }
  if (userId === undefined) return () => {}
  running.set(userId, (running.get(userId) ?? 0) + 1)
  let released = false
  return () => {
    if (released) return
    released = true
    const left = (running.get(userId) ?? 1) - 1
    if (left > 0) running.set(userId, left)
    else running.delete(userId)
  }
}
