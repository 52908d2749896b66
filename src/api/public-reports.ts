import type { z } from 'zod'
import type { reportBody, reportStatus, streetList } from '../../shared/schemas/reports'
import { http, request } from './http'

export type ReportInput = z.input<typeof reportBody>
export type ReportStatus = z.infer<typeof reportStatus>
export type Street = z.infer<typeof streetList>['items'][number]

/** Validation details as the server sends them: `{ fields: [{ path: 'body.street', message }] }`. */
export interface FieldProblem {
  path: string
  message: string
}

export const publicReportsApi = {
  /** `key`: made when the form opens, so sending again after a lost answer does not file a second report. */
  create: (input: ReportInput, key: string) =>
    request<ReportStatus>('POST', '/reports', { body: input, headers: { 'Idempotency-Key': key } }),
  status: (ref: string) => http.get<ReportStatus>(`/reports/${encodeURIComponent(ref)}`),
  streets: () => http.get<{ items: Street[] }>('/public/streets'),
}

/** The field messages of a validation_failed answer, keyed by field name (`street`, `email`…). */
export function fieldProblems(details: unknown): Record<string, string> {
  const fields = (details as { fields?: FieldProblem[] } | null)?.fields
  const out: Record<string, string> = {}
  if (!Array.isArray(fields)) return out
  for (const f of fields) {
    const name = String(f.path).split('.').slice(1).join('.') || String(f.path)
    out[name] ??= f.message
  }
  return out
}
