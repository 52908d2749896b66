// One error family: an HTTP status and a stable code the client and tests can rely on.
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
  }
}

export const badRequest = (code: string, message: string, details?: unknown) =>
  new HttpError(400, code, message, details)
export const unauthenticated = (message = 'Sign in to continue.') =>
  new HttpError(401, 'unauthenticated', message)
export const forbidden = (message = 'Your role may not do this.') => new HttpError(403, 'forbidden', message)
export const notFound = (what = 'Resource') => new HttpError(404, 'not_found', `${what} not found.`)
export const conflict = (code: string, message: string, details?: unknown) =>
  new HttpError(409, code, message, details)
