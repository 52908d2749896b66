// The safety officer's isolation records: one page at a time, filtered and ordered on the server.
import type { z } from 'zod'
import type { isolationAudit, isolationAuditList, IsolationQuery } from '../../shared/schemas/isolations'
import type { findingFilters, isolationSorts } from '../../shared/vocab/isolations'
import { http } from './http'

export {
  ISOLATION_PAGE_SIZE,
  REVIEW_NOTE_MAX,
  REVIEW_NOTE_MIN,
  findingFilters,
  isolationSorts,
} from '../../shared/vocab/isolations'
export { stepLabel, isolateSteps, restoreSteps, isolationSteps } from '../../shared/vocab/visits'

export type IsolationRecord = z.infer<typeof isolationAudit>
export type IsolationList = z.infer<typeof isolationAuditList>
export type WithoutIsolation = IsolationList['withoutIsolation'][number]
export type ReviewFilter = IsolationQuery['review']
export type FindingFilter = (typeof findingFilters)[number]
export type IsolationSort = (typeof isolationSorts)[number]
export type IsolationFilters = Pick<IsolationQuery, 'review' | 'findings' | 'sort' | 'from' | 'to'>
export type ReviewDecision = 'approved' | 'rejected'

export const isolationsApi = {
  list: (filters: IsolationFilters, page = 1, pageSize?: number) =>
    http.get<IsolationList>('/isolations', { ...filters, page, pageSize }),
  /** A rejection, or approving a record with a serious finding, needs a note (the server checks). */
  review: (id: number, decision: ReviewDecision, note?: string) =>
    http.post<void>(`/isolations/${id}/review`, { decision, note }),
}
