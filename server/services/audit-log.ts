// Reading the audit log (services/audit.ts writes it): filtered and paged in MariaDB, each entry with
// who did it and the record before and after where the change stored both.
import type { Db } from '../db'
import { badRequest } from '../errors'
import { config } from '../config'
import { addDays, localInstant } from '../../shared/local-time'
import { iso } from '../../shared/iso-time'
import type { AuditEntry, AuditQuery } from '../../shared/schemas/audit'

/** Never shown, whatever a caller once put in a log row's details. */
const SECRET_KEY = /pass(word)?|token|secret|hash/i

function redact(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(redact)
  if (!v || typeof v !== 'object') return v
  return Object.fromEntries(
    Object.entries(v as Record<string, unknown>).map(([k, x]) => [
      k,
      SECRET_KEY.test(k) ? '(hidden)' : redact(x),
    ]),
  )
}

function parse(raw: unknown): unknown {
  if (typeof raw !== 'string') return raw ?? null
  try {
    return JSON.parse(raw)
  } catch {
    return raw
  }
}

/** `{ before, after }` as stored by the estate's edits; any other details are the change as asked. */
function beforeAfter(details: unknown): { before: unknown; after: unknown } {
  const d = redact(parse(details))
  if (d && typeof d === 'object' && !Array.isArray(d) && ('before' in d || 'after' in d)) {
    const o = d as { before?: unknown; after?: unknown }
    return { before: o.before ?? null, after: o.after ?? null }
  }
  return { before: null, after: d ?? null }
}

export async function listAudit(db: Db, q: AuditQuery, zone = config.APP_TIME_ZONE) {
  if (q.entityId !== undefined && q.entity === undefined)
    throw badRequest('entity_required', 'Give the kind of record (entity) with its id, e.g. entity=string.')
  if (q.from && q.to && q.from > q.to)
    throw badRequest(
      'date_range_reversed',
      `The period starts (${q.from}) after it ends (${q.to}): swap the dates.`,
      {
        from: q.from,
        to: q.to,
      },
    )
  const base = db('auditLog as a')
  if (q.entity) base.where('a.entity', q.entity)
  if (q.entityId !== undefined) base.where('a.entityId', q.entityId)
  if (q.userId !== undefined) base.where('a.userId', q.userId)
  // Days as a person reads them: midnight to midnight on the app's clock.
  if (q.from) base.where('a.at', '>=', localInstant(q.from, '00:00', zone))
  if (q.to) base.where('a.at', '<', localInstant(addDays(q.to, 1), '00:00', zone))
  const [{ n }] = await base.clone().count({ n: '*' })
  const rows = await base
    .leftJoin('users as u', 'u.id', 'a.userId')
    .orderBy('a.at', 'desc')
    .orderBy('a.id', 'desc')
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .select('a.*', 'u.name as userName', 'u.role as userRole')
  const entities = (await db('auditLog').distinct('entity').orderBy('entity')).map(
    (r: { entity: string }) => r.entity,
  )
  const items: AuditEntry[] = rows.map((r) => ({
    id: Number(r.id),
    at: iso(r.at),
    user: r.userId ? { id: r.userId, name: r.userName ?? `User ${r.userId}`, role: r.userRole ?? '' } : null,
    action: r.action,
    entity: r.entity,
    entityId: r.entityId ?? null,
    ...beforeAfter(r.details),
    requestId: r.requestId ?? null,
  }))
  return { items, total: Number(n), page: q.page, pageSize: q.pageSize, entities }
}
