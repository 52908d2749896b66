// The one way the client talks to the server: same origin, session cookie, JSON both ways.
// Every failure surfaces as an ApiError carrying the server's stable `code`, so pages branch on
// codes rather than on message text.

export const API_BASE = '/api/v1'

export class ApiError extends Error {
  readonly status: number
  readonly code: string
  readonly details: unknown

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message)
    this.name = 'ApiError'
    this.status = status
    this.code = code
    this.details = details
  }
}

export type Query = Record<string, string | number | boolean | null | undefined>

export interface RequestOptions {
  query?: Query
  body?: unknown
  signal?: AbortSignal
}

function buildUrl(path: string, query?: Query): string {
  const url = `${API_BASE}${path}`
  if (!query) return url
  const params = new URLSearchParams()
  for (const [key, value] of Object.entries(query)) {
    if (value !== null && value !== undefined) params.set(key, String(value))
  }
  const qs = params.toString()
  return qs ? `${url}?${qs}` : url
}

interface ErrorBody {
  error?: { code?: string; message?: string; details?: unknown }
}

async function toApiError(res: Response): Promise<ApiError> {
  let body: ErrorBody | null = null
  try {
    body = (await res.json()) as ErrorBody
  } catch {
    // A proxy or crash page answered instead of the API; fall through to a generic error.
  }
  const err = body?.error
  return new ApiError(
    res.status,
    err?.code ?? `http_${res.status}`,
    err?.message ?? res.statusText ?? 'Request failed',
    err?.details,
  )
}

// Set once at start-up (main.ts): what to do when the session has ended mid-use.
let onUnauthenticated: (() => void) | null = null
export function setUnauthenticatedHandler(handler: () => void): void {
  onUnauthenticated = handler
}

export async function request<T>(method: string, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' }
  const init: RequestInit = { method, credentials: 'include', headers, signal: options.signal }
  if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json'
    init.body = JSON.stringify(options.body)
  }

  let res: Response
  try {
    res = await fetch(buildUrl(path, options.query), init)
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause
    // status 0 marks "never reached the server": weak signal, server down, or offline.
    throw new ApiError(0, 'network_error', 'Could not reach the server. Check the connection and try again.')
  }

  if (!res.ok) {
    const error = await toApiError(res)
    // `/auth/me` answering 401 is the normal "not signed in" case at start-up, not an expiry.
    if (error.code === 'unauthenticated' && path !== '/auth/me') onUnauthenticated?.()
    throw error
  }
  if (res.status === 204) return undefined as T
  const text = await res.text()
  return (text ? JSON.parse(text) : undefined) as T
}

export const http = {
  get: <T>(path: string, query?: Query, signal?: AbortSignal) => request<T>('GET', path, { query, signal }),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, { body }),
  patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, { body }),
  put: <T>(path: string, body?: unknown) => request<T>('PUT', path, { body }),
  delete: <T>(path: string) => request<T>('DELETE', path),
}

export function isApiError(err: unknown, code?: string): err is ApiError {
  return err instanceof ApiError && (code === undefined || err.code === code)
}
