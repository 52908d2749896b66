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

/** Runs a change and writes its audit row in one transaction: both are saved or neither is. */
export async function audited<T>(
  db: Db,
  change: (trx: Db) => Promise<T>,
  entry: (result: T) => AuditEntry,
): Promise<T> {
  return db.transaction(async (trx) => {
    const result = await change(trx)
    await audit(trx, entry(result))
    return result
  })
}
