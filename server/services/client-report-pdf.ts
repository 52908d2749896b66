// The client report as a PDF the manager sends the client: the same figures as GET /client-report
// (services/client-report.ts) and the strings needing work now, gathered here; laid out and drawn on
// a worker thread (client-report-pdf-layout.ts), as drawing a PDF holds a core for a while.
import type { Db } from '../db'
import { config } from '../config'
import { clientReport } from './client-report'
import { clientZone } from './zones'
import { formatInZone } from '../../shared/local-time'
import { pdfInPool, type JobOwner } from '../workers/heavy-jobs'
import type { StringOut } from './client-report-pdf-layout'

/** Strings of the client that need work now, worst first: what the client will ask about. */
async function stringsOut(db: Db, clientId: number): Promise<StringOut[]> {
  return db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .where('si.clientId', clientId)
    .whereIn('s.status', ['dark', 'replace'])
    .orderByRaw("s.status = 'dark' desc")
    .orderBy('s.assetTag')
    .select('s.assetTag', 's.name', 's.status', 'si.name as site')
}

export async function clientReportPdf(
  db: Db,
  q: { clientId: number; from?: string; to?: string },
  owner?: JobOwner,
  now = new Date(),
): Promise<{ buffer: Buffer; filename: string }> {
  const report = await clientReport(db, q, now)
  const zone = await clientZone(db, report.client.id)
  const out = await stringsOut(db, report.client.id)
  const madeAt = formatInZone(now, zone, config.APP_LOCALE, 'dateTime')
  const bytes = await pdfInPool({ report, out, madeAt, locale: config.APP_LOCALE }, owner)
  const slug = report.client.name.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'client'
  return { buffer: Buffer.from(bytes), filename: `client-report-${slug}-${report.from}-to-${report.to}.pdf` }
}
