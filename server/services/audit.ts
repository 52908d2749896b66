import type { Db } from '../db'

export interface AuditEntry {
  userId: number | null
  action: string
  entity: string
  entityId?: number | null
  details?: unknown
  requestId?: string
}

export async function audit(db: Db, e: AuditEntry): Promise<void> {
  await db('auditLog').insert({
    at: new Date(),
    userId: e.userId,
    action: e.action,
    entity: e.entity,
    entityId: e.entityId ?? null,
    details: e.details === undefined ? null : JSON.stringify(e.details),
    requestId: e.requestId ?? null,
  })
}
