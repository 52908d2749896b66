// The audit log, read by managers, safety officers and admins: who changed what, when, before and after.
import { auditReaders } from '../../shared/roles'
import { auditPage, auditQuery } from '../../shared/schemas/audit'
import { defineRoute, type RouteDef } from '../route-table'
import { listAudit } from '../services/audit-log'

export const auditRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/audit',
    access: auditReaders,
    tag: 'settings',
    summary: 'The audit log, newest first, filtered by record, user and days (app zone), paged',
    query: auditQuery,
    response: auditPage,
    handler: ({ deps, query }) => listAudit(deps.db, query, deps.config.APP_TIME_ZONE),
  }),
]
