// The Idempotency-Key header: a UUID made on the device before the first send, so a retried send
// (the answer was lost to a bad signal) is recognised and answered with the first result. A route
// row declares it (`idempotency: 'required' | 'optional'`); the route table mounts this check and the
// OpenAPI document lists the header from the same declaration.
import type { Request, RequestHandler } from 'express'
import { z } from 'zod'
import { badRequest } from '../errors'
import { idempotencyKey } from '../../shared/schemas/visits'

export const IDEMPOTENCY_HEADER = 'Idempotency-Key'

export type Idempotency = 'required' | 'optional'

/** The header as the OpenAPI document shows it. */
export function idempotencyHeaders(mode: Idempotency) {
  const key = idempotencyKey.meta({
    description: 'A UUID made on the device before the first send; a repeat returns the first result.',
  })
  return z.object({ [IDEMPOTENCY_HEADER]: mode === 'required' ? key : key.optional() })
}

/** The validated key, or null when an optional one was not sent. */
export function readIdempotencyKey(req: Request, mode: Idempotency): string | null {
  const raw = req.header(IDEMPOTENCY_HEADER)
  if (raw === undefined || raw.trim() === '') {
    if (mode === 'optional') return null
    throw badRequest(
      'idempotency_key_required',
      'Send an Idempotency-Key header (a UUID made on the device).',
    )
  }
  const r = idempotencyKey.safeParse(raw)
  if (!r.success)
    throw badRequest(
      'idempotency_key_invalid',
      'The Idempotency-Key header must be a UUID: 8 to 64 letters, digits, "-" or "_".',
    )
  return r.data
}

/** Checks the header before any work (an upload is not even read) and leaves the key for the handler. */
export function idempotencyCheck(mode: Idempotency): RequestHandler {
  return (req, res, next) => {
    res.locals.idempotencyKey = readIdempotencyKey(req, mode)
    next()
  }
}
