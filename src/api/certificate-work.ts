// Certificates driving work: finding a subject for its first certificate, the certificate's document,
// and the certificate items in the queue (GET /queue by kind; safety officers see only these).
import type { z } from 'zod'
import type { certificateDocumentSaved, subjectList } from '../../shared/schemas/certificates'
import { CERTIFICATE_DOCUMENT_FIELD, safetyQueueKinds } from '../../shared/vocab/certificates'
import { API_BASE, http, request } from './http'
import type { QueueItem } from './queue'

export { CERTIFICATE_DOCUMENT_MAX_MB, certificateDocumentTypes } from '../../shared/vocab/certificates'

export type CertificateSubject = z.infer<typeof subjectList>['items'][number]
export type CertificateDocument = z.infer<typeof certificateDocumentSaved>

export const certificateWorkApi = {
  subjects: (q: string, signal?: AbortSignal) =>
    http.get<z.infer<typeof subjectList>>('/certificates/subjects', { q }, signal).then((r) => r.items),
  uploadDocument: (id: number, file: File, onUploadProgress?: (f: number) => void) => {
    const body = new FormData()
    body.append(CERTIFICATE_DOCUMENT_FIELD, file)
    return request<CertificateDocument>('POST', `/certificates/${id}/document`, { body, onUploadProgress })
  },
  /** Opened in a new tab: the session cookie goes with it, and the server checks the role. */
  documentUrl: (id: number) => `${API_BASE}/certificates/${id}/document`,
  /** Open certificate work, emergencies first, then by score (as the queue ranks it). */
  async queueItems(): Promise<QueueItem[]> {
    const pages = await Promise.all(
      safetyQueueKinds.map((kind) =>
        http.get<{ items: QueueItem[] }>('/queue', { kind, state: 'open', pageSize: 100 }),
      ),
    )
    return pages
      .flatMap((p) => p.items)
      .sort(
        (a, b) =>
          Number(b.severity === 'emergency') - Number(a.severity === 'emergency') || b.score - a.score,
      )
  },
}
