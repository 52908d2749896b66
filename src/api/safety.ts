import type { z } from 'zod'
import type {
  certificateBody,
  certificateCreated,
  certificateKinds,
  certificateList,
  certificateQuery,
  certificateRow,
} from '../../shared/schemas/certificates'
import type { isolationAudit, isolationAuditList, isolationQuery } from '../../shared/schemas/isolations'
import { http } from './http'

export { certificateKindLabel, certificateKinds } from '../../shared/schemas/certificates'
export { stepLabel, isolateSteps, restoreSteps, isolationSteps } from '../../shared/schemas/visits'

export type IsolationRecord = z.infer<typeof isolationAudit>
export type IsolationList = z.infer<typeof isolationAuditList>
export type WithoutIsolation = IsolationList['withoutIsolation'][number]
export type ReviewFilter = z.infer<typeof isolationQuery>['review']
export type ReviewDecision = 'approved' | 'rejected'

export type CertificateRecord = z.infer<typeof certificateRow>
export type CertificateKind = (typeof certificateKinds)[number]
export type DueFilter = z.infer<typeof certificateQuery>['due']
export type CertificateInput = z.input<typeof certificateBody>
export type CertificateReadings = NonNullable<CertificateInput['readings']>
export type CertificateCreated = z.infer<typeof certificateCreated>

export const isolationsApi = {
  list: (review: ReviewFilter, limit = 100) => http.get<IsolationList>('/isolations', { review, limit }),
  /** A rejection needs a note (the page asks for one); the server stores whichever is given. */
  review: (id: number, decision: ReviewDecision, note?: string) =>
    http.post<void>(`/isolations/${id}/review`, { decision, note }),
}

export const certificatesApi = {
  list: (filter: { kind?: CertificateKind; due?: DueFilter } = {}) =>
    http.get<z.infer<typeof certificateList>>('/certificates', filter),
  record: (input: CertificateInput) => http.post<CertificateCreated>('/certificates', input),
}
