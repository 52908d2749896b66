// Public reports at the work: the passer-by's one photo, the crew's emergency log (sent by the outbox
// with an Idempotency-Key made on the phone) and its photo, and what a string's page shows of both.
import type { z } from 'zod'
import type {
  EmergencyLog,
  EmergencyLogBody,
  ReportNote,
  StringWorkNotes,
  reportPhotoResult,
} from '../../shared/schemas/report-work'
import { http, request, type RequestOptions } from './http'

export type { EmergencyLog, EmergencyLogBody, ReportNote, StringWorkNotes }

const keyed = (key: string, timeoutMs: number): RequestOptions => ({
  headers: { 'Idempotency-Key': key },
  timeoutMs,
  reportSessionEnd: false,
})

export const reportWorkApi = {
  /** The report's one photo, with the one-time key its answer gave. */
  reportPhoto: (ref: string, photoKey: string, file: Blob, fileName: string) => {
    const form = new FormData()
    form.append('photoKey', photoKey)
    form.append('photo', file, fileName)
    return request<z.infer<typeof reportPhotoResult>>('POST', `/reports/${encodeURIComponent(ref)}/photo`, {
      body: form,
      timeoutMs: 180_000,
    })
  },
  logEmergency: (itemId: number, key: string, body: EmergencyLogBody) =>
    request<EmergencyLog>('POST', `/queue/${itemId}/emergency-log`, { body, ...keyed(key, 30_000) }),
  emergencyPhoto: (
    logId: number,
    key: string,
    file: Blob,
    fileName: string,
    onProgress?: (f: number) => void,
  ) => {
    const form = new FormData()
    form.append('photo', file, fileName)
    return request<EmergencyLog>('POST', `/emergency-logs/${logId}/photo`, {
      body: form,
      ...keyed(key, 180_000),
      onUploadProgress: onProgress,
    })
  },
  workNotes: (stringId: number) => http.get<StringWorkNotes>(`/strings/${stringId}/work-notes`),
}
