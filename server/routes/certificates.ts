import { office, safetyOfficers } from '../../shared/roles'
import {
  certificateBody,
  certificateCreated,
  certificateList,
  certificateQuery,
} from '../../shared/schemas/certificates'
import { defineRoute, type RouteDef } from '../route-table'
import { listCertificates, recordCertificate } from '../services/certificates'
import { audited } from '../services/audit'

export const certificateRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/certificates',
    access: office,
    tag: 'safety',
    summary: 'Latest certificate per subject and kind, filtered by due state',
    query: certificateQuery,
    response: certificateList,
    handler: async ({ deps, query }) => ({ items: await listCertificates(deps.db, query) }),
  }),
  defineRoute({
    method: 'post',
    path: '/certificates',
    access: safetyOfficers,
    tag: 'safety',
    summary: 'Record a test or inspection; RCD and insulation readings decide pass or fail',
    body: certificateBody,
    response: certificateCreated,
    status: 201,
    handler: ({ deps, body, user, req }) =>
      audited(
        deps.db,
        (trx) => recordCertificate(trx, user.id, body),
        (c) => ({
          userId: user.id,
          action: 'certificate',
          entity: 'certificate',
          entityId: c.id,
          details: { kind: body.kind, result: c.result },
          requestId: String(req.id),
        }),
      ),
  }),
]
