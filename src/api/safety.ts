// Certificates on the safety officer's pages (isolations: api/isolations.ts).
import type { z } from 'zod'
import type {
  certificateBody,
  certificateCreated,
  certificateList,
  certificateQuery,
  certificateRow,
} from '../../shared/schemas/certificates'
import type { certificateKinds } from '../../shared/vocab/certificates'
import { http } from './http'

export { certificateKindLabel, certificateKinds } from '../../shared/vocab/certificates'

export type CertificateRecord = z.infer<typeof certificateRow>
export type CertificateKind = (typeof certificateKinds)[number]
export type DueFilter = z.infer<typeof certificateQuery>['due']
export type CertificateInput = z.input<typeof certificateBody>
export type CertificateReadings = NonNullable<CertificateInput['readings']>
export type CertificateCreated = z.infer<typeof certificateCreated>

export const certificatesApi = {
  list: (filter: { kind?: CertificateKind; due?: DueFilter } = {}) =>
    http.get<z.infer<typeof certificateList>>('/certificates', filter),
  record: (input: CertificateInput) => http.post<CertificateCreated>('/certificates', input),
}
