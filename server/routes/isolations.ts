import { office, safetyOfficers } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import { isolationAuditList, isolationQuery, reviewBody } from '../../shared/schemas/isolations'
import { defineRoute, type RouteDef } from '../route-table'
import { listIsolationAudits, reviewIsolation } from '../services/isolation-audit'
import { audited } from '../services/audit'

export const isolationRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/isolations',
    access: office,
    tag: 'safety',
    summary: 'Isolation records with their steps and findings, for sign-off',
    query: isolationQuery,
    response: isolationAuditList,
    handler: ({ deps, query }) => listIsolationAudits(deps.db, query),
  }),
  defineRoute({
    method: 'post',
    path: '/isolations/:id/review',
    access: safetyOfficers,
    tag: 'safety',
    summary: 'Approve or reject an isolation record',
    params: idParam,
    body: reviewBody,
    handler: async ({ deps, params, body, user, req }) => {
      await audited(
        deps.db,
        (trx) => reviewIsolation(trx, params.id, user.id, body.decision, body.note),
        () => ({
          userId: user.id,
          action: `isolation_${body.decision}`,
          entity: 'isolation',
          entityId: params.id,
          details: body,
          requestId: String(req.id),
        }),
      )
    },
  }),
]
