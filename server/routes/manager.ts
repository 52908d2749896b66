import { energyReport, registerList, registerQuery } from '../../shared/schemas/energy'
import { defineRoute, type RouteDef } from '../route-table'
import { energyReport as buildEnergy } from '../services/energy'
import { listRegister } from '../services/register'
import { clientReport } from '../services/client-report'
import { clientReport as clientReportSchema, clientReportQuery } from '../../shared/schemas/client-report'

export const managerRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/energy',
    access: ['manager', 'supervisor', 'admin'],
    tag: 'register',
    summary: 'Energy a night and a season per client, site and string type, priced at each tariff',
    response: energyReport,
    handler: ({ deps }) => buildEnergy(deps.db),
  }),
  defineRoute({
    method: 'get',
    path: '/register',
    access: ['manager', 'supervisor', 'safety', 'admin'],
    tag: 'register',
    summary: 'The register of every string with type, place, circuit and structure',
    query: registerQuery,
    response: registerList,
    handler: ({ deps, query }) => listRegister(deps.db, query),
  }),
  defineRoute({
    method: 'get',
    path: '/client-report',
    access: ['manager', 'admin'],
    tag: 'register',
    summary:
      'A period report for one client: register state, work done, faults against contract times, reports, energy',
    query: clientReportQuery,
    response: clientReportSchema,
    handler: ({ deps, query }) => clientReport(deps.db, query),
  }),
]
