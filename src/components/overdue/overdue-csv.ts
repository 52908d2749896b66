import dayjs from 'dayjs'
import { queueKindLabel, type OverdueReport } from '../../api/overdue'

type Cell = string | number | null

// Spreadsheets run a cell that starts with = + - @ (or a tab or carriage return) as a formula, so
// text from the field or the public is neutralised with a leading quote (OWASP "CSV Injection").
const FORMULA_START = /^[=+\-@\t\r]/

/** One CSV cell: text neutralised and quoted where RFC 4180 needs it; numbers as they are. */
export function csvCell(value: Cell): string {
  if (value === null) return ''
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : ''
  const text = FORMULA_START.test(value) ? `'${value}` : value
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text
}

/** Rows to CSV text with CRLF line ends (RFC 4180). */
export function toCsv(rows: Cell[][]): string {
  return rows.map((row) => row.map(csvCell).join(',')).join('\r\n') + '\r\n'
}

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
  const when = (iso: string) => dayjs(iso).format('YYYY-MM-DD HH:mm')
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

/** Saves the report as a file; the byte-order mark lets spreadsheet programs read it as UTF-8. */
export function downloadCsv(report: OverdueReport): void {
  const blob = new Blob(['\uFEFF', toCsv(overdueRows(report))], { type: 'text/csv;charset=utf-8' })
  const url = URL.createObjectURL(blob)
  const a = document.createElement('a')
  a.href = url
  a.download = `lampwright-overdue-${dayjs(report.generatedAt).format('YYYY-MM-DD-HHmm')}.csv`
  document.body.appendChild(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 1000)
}
