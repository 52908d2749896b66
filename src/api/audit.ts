import type { AuditEntry, AuditPage, AuditQuery } from '../../shared/schemas/audit'
import { http } from './http'

export type { AuditEntry, AuditPage }
export type AuditFilters = Partial<Omit<AuditQuery, 'page' | 'pageSize'>>

export const auditApi = {
  list: (filters: AuditFilters, page = 1, pageSize?: number) =>
    http.get<AuditPage>('/audit', { ...filters, page, pageSize }),
}
