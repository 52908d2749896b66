// The one way the client talks to the server: same origin, session cookie, JSON both ways (or a form
// for uploads). Every failure surfaces as an ApiError carrying the server's stable `code`, so pages
// branch on codes rather than on message text.

import { API_BASE } from './base'

export { API_BASE }

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
  /** Sent as JSON, or as it is when a FormData. */
  body?: unknown
  signal?: AbortSignal
  headers?: Record<string, string>
  /** Gives up (as a network error, so it is retried) when the server has not answered by then. */
  timeoutMs?: number
  /** Upload progress, 0 to 1. Only uploads need it; they then go through XMLHttpRequest. */
  onUploadProgress?: (fraction: number) => void
  /** false: a 401 is only thrown, not reported as the session ending (the outbox says so itself). */
  reportSessionEnd?: boolean
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

// Set once at start-up (main.ts): what to do when the session has ended mid-use.
let onUnauthenticated: (() => void) | null = null
export function setUnauthenticatedHandler(handler: () => void): void {
  onUnauthenticated = handler
}

/** What either transport brings back, before it is read as the answer or as an ApiError. */
interface Raw {
  status: number
  statusText: string
  text: string
}

function networkError(): ApiError {
  // status 0 marks "never reached the server": weak signal, server down, or offline.
  return new ApiError(0, 'network_error', 'Could not reach the server. Check the connection and try again.')
}

function toApiError(raw: Raw): ApiError {
  let body: { error?: { code?: string; message?: string; details?: unknown } } | null = null
  try {
    body = JSON.parse(raw.text)
  } catch {
    // A proxy or crash page answered instead of the API; fall through to a generic error.
  }
  const err = body?.error
  return new ApiError(
    raw.status,
    err?.code ?? `http_${raw.status}`,
    err?.message ?? (raw.statusText || 'Request failed'),
    err?.details,
  )
}

function readAnswer<T>(raw: Raw, path: string, options: RequestOptions): T {
  if (raw.status < 200 || raw.status >= 300) {
    const error = toApiError(raw)
    // `/auth/me` answering 401 is the normal "not signed in" case at start-up, not an expiry.
    const report = options.reportSessionEnd !== false && path !== '/auth/me'
    if (error.code === 'unauthenticated' && report) onUnauthenticated?.()
    throw error
  }
  if (!raw.text) return undefined as T
  try {
    return JSON.parse(raw.text) as T
  } catch {
    throw new ApiError(raw.status, 'bad_response', 'The server answered with something unreadable.')
  }
}

async function viaFetch(
  method: string,
  url: string,
  headers: Record<string, string>,
  options: RequestOptions,
) {
  const body = encode(options.body)
  let signal = options.signal
  let timer: ReturnType<typeof setTimeout> | undefined
  if (options.timeoutMs) {
    const own = new AbortController()
    timer = setTimeout(() => own.abort(), options.timeoutMs)
    if (signal?.aborted) own.abort()
    else signal?.addEventListener('abort', () => own.abort(), { once: true })
    signal = own.signal
  }
  try {
    const res = await fetch(url, { method, credentials: 'include', headers, signal, body })
    return { status: res.status, statusText: res.statusText, text: await res.text() }
  } catch (cause) {
    // The caller's own abort stays an abort; a timeout counts as no answer.
    if (options.signal?.aborted) throw cause
    throw networkError()
  } finally {
    clearTimeout(timer)
  }
}

// fetch cannot report upload progress; XMLHttpRequest can.
function viaXhr(method: string, url: string, headers: Record<string, string>, options: RequestOptions) {
  return new Promise<Raw>((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open(method, url)
    xhr.withCredentials = true
    xhr.timeout = options.timeoutMs ?? 0
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value)
    const report = options.onUploadProgress
    xhr.upload.onprogress = (e) => {
      if (report && e.lengthComputable && e.total > 0) report(e.loaded / e.total)
    }
    xhr.onload = () =>
      xhr.status === 0
        ? reject(networkError())
        : resolve({ status: xhr.status, statusText: xhr.statusText, text: xhr.responseText })
    xhr.onerror = xhr.ontimeout = () => reject(networkError())
    xhr.onabort = () => reject(options.signal?.reason ?? networkError())
    options.signal?.addEventListener('abort', () => xhr.abort(), { once: true })
    xhr.send(encode(options.body) ?? null)
  })
}

function encode(body: unknown): string | FormData | undefined {
  if (body === undefined || body instanceof FormData) return body
  return JSON.stringify(body)
}

export async function request<T>(method: string, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers }
  // A FormData sets its own multipart type, boundary included.
  if (options.body !== undefined && !(options.body instanceof FormData))
    headers['Content-Type'] = 'application/json'
  const url = buildUrl(path, options.query)
  const send = options.onUploadProgress ? viaXhr : viaFetch
  return readAnswer<T>(await send(method, url, headers, options), path, options)
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
