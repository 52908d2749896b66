import type { ErrorRequestHandler, RequestHandler } from 'express'
import { HttpError } from '../errors'

export const apiNotFound: RequestHandler = (req, res) => {
  res
    .status(404)
    .json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.originalUrl}.` } })
}

/** The one place errors become responses; unknown errors are logged and answered generically. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, details: err.details } })
    return
  }
  const e = err as { type?: string; status?: number; code?: string }
  if (e.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'invalid_json', message: 'The request body is not valid JSON.' } })
    return
  }
  if (e.type === 'entity.too.large' || e.code === 'LIMIT_FILE_SIZE') {
    res.status(413).json({ error: { code: 'too_large', message: 'The request is larger than allowed.' } })
    return
  }
  req.log?.error({ err }, 'unhandled error')
  res
    .status(500)
    .json({ error: { code: 'internal', message: 'Something went wrong on our side. It has been logged.' } })
}
