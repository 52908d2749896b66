import type { Request } from 'express'
import { badRequest } from '../errors'
import { idempotencyKey } from '../../shared/schemas/visits'

/** The client-generated Idempotency-Key header that makes a retried send safe. */
export function requireIdempotencyKey(req: Request): string {
  const r = idempotencyKey.safeParse(req.header('Idempotency-Key'))
  if (!r.success)
    throw badRequest(
      'idempotency_key_required',
      'Send an Idempotency-Key header (a UUID made on the device).',
    )
  return r.data
}
