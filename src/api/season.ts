// The season's calls: commissioning, store inspection and take-down (keyed writes the outbox sends),
// marking a string in service, and the office's lists.
import type { z } from 'zod'
import type {
  CommissioningBody,
  CommissioningResult,
  StoreInspectionBody,
  TakeDownBody,
  TakeDownResult,
  commissioningList,
  repairList,
  seasonGlance,
  seasonStateResult,
} from '../../shared/schemas/season'
import { request, type RequestOptions } from './http'

export type CommissioningList = z.infer<typeof commissioningList>
export type CommissioningRow = CommissioningList['items'][number]
export type RepairList = z.infer<typeof repairList>
export type SeasonGlance = z.infer<typeof seasonGlance>
export type { CommissioningBody, CommissioningResult, StoreInspectionBody, TakeDownBody, TakeDownResult }

// As the visit's own calls: a 401 is the outbox's to report, not the session's end.
const keyed = (key: string): RequestOptions => ({
  headers: { 'Idempotency-Key': key },
  timeoutMs: 30_000,
  reportSessionEnd: false,
})

export const seasonApi = {
  commission: (key: string, stringId: number, body: CommissioningBody) =>
    request<CommissioningResult>('POST', `/strings/${stringId}/commissioning`, { body, ...keyed(key) }),
  inspectInStore: (key: string, stringId: number, body: StoreInspectionBody) =>
    request<CommissioningResult>('POST', `/strings/${stringId}/store-inspection`, { body, ...keyed(key) }),
  takeDown: (key: string, stringId: number, body: TakeDownBody) =>
    request<TakeDownResult>('POST', `/strings/${stringId}/take-down`, { body, ...keyed(key) }),
  setState: (stringId: number, state: 'in_service' | 'installed') =>
    request<z.infer<typeof seasonStateResult>>('PUT', `/strings/${stringId}/season-state`, {
      body: { state },
    }),
  commissionings: (query: { stringId?: number; result?: string; limit?: number } = {}) =>
    request<CommissioningList>('GET', '/commissionings', { query }),
  repairs: () => request<RepairList>('GET', '/season/repairs'),
  glance: () => request<SeasonGlance>('GET', '/season/glance'),
}
