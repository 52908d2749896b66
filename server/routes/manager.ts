import { energyReport, registerList, registerQuery } from '../../shared/schemas/energy'
import { defineRoute, type RouteDef } from '../route-table'
import { energyReport as buildEnergy } from '../services/energy'
import { listRegister } from '../services/register'

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
]
