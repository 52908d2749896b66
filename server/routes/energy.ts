import { planners } from '../../shared/roles'
import { ledWhatIf, ledWhatIfQuery } from '../../shared/schemas/energy'
import { defineRoute, type RouteDef } from '../route-table'
import { ledWhatIf as buildLedWhatIf } from '../services/energy'

// The energy page's what-ifs; the season report itself is GET /energy (manager.ts). Same roles.
export const energyRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/energy/led-what-if',
    access: planners,
    tag: 'register',
    summary:
      "A client's filament strings re-lamped on a chosen LED type: kWh and cost a season beside today's",
    query: ledWhatIfQuery,
    response: ledWhatIf,
    handler: ({ deps, query }) => buildLedWhatIf(deps.db, query),
  }),
]
