// Writes from the field. Each carries an Idempotency-Key made on the phone, so the outbox can repeat
// a send after a dropped connection without recording anything twice. These go through XMLHttpRequest
// rather than http.ts: they need that header and, for photos, upload progress events.
import type { z } from 'zod'
import type { IsolationBody, VisitBody, isolationResult, visitResult } from '../../shared/schemas/visits'
import type { PhotoList } from '../../shared/schemas/photos'
import { PHOTO_FIELD } from '../../shared/schemas/photos'
import type { StringDetail } from '../../shared/schemas/strings'
import { API_BASE, ApiError, http } from './http'

export type VisitResult = z.infer<typeof visitResult>
export type IsolationResult = z.infer<typeof isolationResult>
export type { IsolationBody, VisitBody, StringDetail }

const JSON_TIMEOUT_MS = 30_000
const PHOTO_TIMEOUT_MS = 180_000

interface KeyedRequest {
  path: string
  key: string
  body: string | FormData
  timeoutMs: number
  onProgress?: (fraction: number) => void
}

function networkError(): ApiError {
  return new ApiError(0, 'network_error', 'Could not reach the server. Check the connection and try again.')
}

function toError(xhr: XMLHttpRequest): ApiError {
  let body: { error?: { code?: string; message?: string; details?: unknown } } | null = null
  try {
    body = JSON.parse(xhr.responseText)
  } catch {
    // A proxy page or an empty body: fall back to the status line.
  }
  const err = body?.error
  return new ApiError(
    xhr.status,
    err?.code ?? `http_${xhr.status}`,
    err?.message ?? (xhr.statusText || 'Request failed'),
    err?.details,
  )
}

function postWithKey<T>(req: KeyedRequest): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open('POST', `${API_BASE}${req.path}`)
    xhr.withCredentials = true
    xhr.timeout = req.timeoutMs
    xhr.setRequestHeader('Accept', 'application/json')
    xhr.setRequestHeader('Idempotency-Key', req.key)
    if (typeof req.body === 'string') xhr.setRequestHeader('Content-Type', 'application/json')
    if (req.onProgress) {
      const report = req.onProgress
      xhr.upload.onprogress = (e) => {
        if (e.lengthComputable && e.total > 0) report(e.loaded / e.total)
      }
    }
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve((xhr.responseText ? JSON.parse(xhr.responseText) : undefined) as T)
        } catch {
          reject(new ApiError(xhr.status, 'bad_response', 'The server answered with something unreadable.'))
        }
      } else reject(xhr.status === 0 ? networkError() : toError(xhr))
    }
    xhr.onerror = () => reject(networkError())
    xhr.ontimeout = () => reject(networkError())
    xhr.onabort = () => reject(networkError())
    xhr.send(req.body)
  })
}

export const visitsApi = {
  recordIsolation: (key: string, body: IsolationBody) =>
    postWithKey<IsolationResult>({
      path: '/isolations',
      key,
      body: JSON.stringify(body),
      timeoutMs: JSON_TIMEOUT_MS,
    }),

  logVisit: (key: string, body: VisitBody) =>
    postWithKey<VisitResult>({
      path: '/visits',
      key,
      body: JSON.stringify(body),
      timeoutMs: JSON_TIMEOUT_MS,
    }),

  /** One photo per request, so each has its own progress bar and a failed one does not hold back the rest. */
  uploadPhoto: (
    visitId: number,
    key: string,
    file: Blob,
    fileName: string,
    onProgress?: (f: number) => void,
  ) => {
    const form = new FormData()
    form.append(PHOTO_FIELD, file, fileName)
    return postWithKey<PhotoList>({
      path: `/visits/${visitId}/photos`,
      key,
      body: form,
      timeoutMs: PHOTO_TIMEOUT_MS,
      onProgress,
    })
  },

  stringDetail: (id: number, signal?: AbortSignal) =>
    http.get<StringDetail>(`/strings/${id}`, undefined, signal),
}
