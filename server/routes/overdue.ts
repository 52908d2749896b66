import { planners } from '../../shared/roles'
import { overdueReport } from '../../shared/schemas/overdue'
import { defineRoute, type RouteDef } from '../route-table'
import { overdueReport as buildReport } from '../services/overdue'

export const overdueRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/overdue',
    access: planners,
    tag: 'queue',
    summary: 'Open work per client against contract response times: overdue and due soon',
    response: overdueReport,
    handler: ({ deps }) => buildReport(deps.db),
  }),
]
