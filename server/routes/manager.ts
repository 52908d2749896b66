import { managers, planners } from '../../shared/roles'
import { energyReport } from '../../shared/schemas/energy'
import { defineRoute, type RouteDef } from '../route-table'
import { energyReport as buildEnergy } from '../services/energy'
import { clientReport } from '../services/client-report'
import { clientReportPdf } from '../services/client-report-pdf'
import { clientReport as clientReportSchema, clientReportQuery } from '../../shared/schemas/client-report'

export const managerRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/energy',
    access: planners,
    tag: 'register',
    summary: 'Energy a night and a season per client, site and string type, priced at each tariff',
    response: energyReport,
    handler: ({ deps }) => buildEnergy(deps.db),
  }),
  defineRoute({
    method: 'get',
    path: '/client-report',
    access: managers,
    tag: 'register',
    summary:
      'A period report for one client: register state, work done, faults against contract times, reports, energy',
    query: clientReportQuery,
    response: clientReportSchema,
    handler: ({ deps, query }) => clientReport(deps.db, query),
  }),
  defineRoute({
    method: 'get',
    path: '/client-report.pdf',
    access: managers,
    tag: 'register',
    summary:
      'The client report as a PDF to send the client (same figures, plus the strings needing work now)',
    query: clientReportQuery,
    responseType: 'application/pdf',
    handler: async ({ deps, query, res, user }) => {
      const pdf = await clientReportPdf(deps.db, query, { userId: user.id, res })
      res
        .type('application/pdf')
        .set('Content-Disposition', `attachment; filename="${pdf.filename}"`)
        .set('Cache-Control', 'private, no-store')
        .send(pdf.buffer)
    },
  }),
]
