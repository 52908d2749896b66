// Writes from the field. Each carries an Idempotency-Key made on the phone, so the outbox can repeat
// a send after a dropped connection without recording anything twice.
import type { z } from 'zod'
import type { IsolationBody, VisitBody, isolationResult, visitResult } from '../../shared/schemas/visits'
import type { PhotoList } from '../../shared/schemas/photos'
import { PHOTO_FIELD } from '../../shared/vocab/photos'
import { request, type RequestOptions } from './http'

export type VisitResult = z.infer<typeof visitResult>
export type IsolationResult = z.infer<typeof isolationResult>
export type { IsolationBody, VisitBody }

const JSON_TIMEOUT_MS = 30_000
const PHOTO_TIMEOUT_MS = 180_000

// A 401 here is not reported as the session ending: the outbox says so itself and keeps its place.
const keyed = (key: string, timeoutMs: number): RequestOptions => ({
  headers: { 'Idempotency-Key': key },
  timeoutMs,
  reportSessionEnd: false,
})

export const visitsApi = {
  recordIsolation: (key: string, body: IsolationBody) =>
    request<IsolationResult>('POST', '/isolations', { body, ...keyed(key, JSON_TIMEOUT_MS) }),

  logVisit: (key: string, body: VisitBody) =>
    request<VisitResult>('POST', '/visits', { body, ...keyed(key, JSON_TIMEOUT_MS) }),

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
    return request<PhotoList>('POST', `/visits/${visitId}/photos`, {
      body: form,
      ...keyed(key, PHOTO_TIMEOUT_MS),
      onUploadProgress: onProgress,
    })
  },
}
