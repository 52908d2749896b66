import { queueKindLabel, type OverdueReport } from '../../api/overdue'
import { saveCsv, type Cell } from '../common/csv'
import { formatDate } from '../../dates'

const round = (h: number) => Math.round(h * 10) / 10

const HEADER = [
  'Client',
  'Contract',
  'Status',
  'Hours late',
  'Hours left',
  'Due by',
  'Kind',
  'Severity',
  'Summary',
  'Site',
  'String',
  'Public report',
  'Opened',
]

/** Every overdue and due-soon item, one line each, with its client's contract. */
export function overdueRows(report: OverdueReport): Cell[][] {
  const when = (iso: string) => formatDate(iso, 'csv')
  const rows: Cell[][] = [HEADER]
  for (const client of report.clients) {
    for (const item of client.items) {
      rows.push([
        client.name,
        client.contractRef,
        item.overdue ? 'Overdue' : 'Due soon',
        // Two positive columns instead of a signed one: clearer to read, and no cell starts with "-".
        item.overdue ? round(-item.hoursLeft) : null,
        item.overdue ? null : round(item.hoursLeft),
        when(item.dueBy),
        queueKindLabel[item.kind],
        item.severity === 'emergency' ? 'Emergency' : 'Standard',
        item.summary,
        item.site?.name ?? null,
        item.string?.assetTag ?? null,
        item.reportRef,
        when(item.openedAt),
      ])
    }
  }
  return rows
}

/** Saves the report as a dated file. */
export function downloadCsv(report: OverdueReport): void {
  saveCsv(`lampwright-overdue-${formatDate(report.generatedAt, 'file')}.csv`, overdueRows(report))
}
