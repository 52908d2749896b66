import type { RequestHandler } from 'express'
import type { ZodType } from 'zod'
import { badRequest } from '../errors'

interface Schemas {
  body?: ZodType
  query?: ZodType
  params?: ZodType
}

function check(schema: ZodType | undefined, value: unknown, where: string): unknown {
  if (!schema) return value
  const r = schema.safeParse(value ?? {})
  if (r.success) return r.data
  const fields = r.error.issues.map((i) => ({ path: [where, ...i.path].join('.'), message: i.message }))
  throw badRequest('validation_failed', `Some ${where} fields are not valid.`, { fields })
}

/** Parses body, query and params with the route's zod schemas into res.locals.valid. */
export function validate(s: Schemas): RequestHandler {
  return (req, res, next) => {
    res.locals.valid = {
      params: check(s.params, req.params, 'params'),
      query: check(s.query, req.query, 'query'),
      body: check(s.body, req.body, 'body'),
    }
    next()
  }
}
