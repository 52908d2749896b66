// CSV export for every page that offers one: cells neutralised against formula injection, RFC 4180
// quoting, saved with a byte-order mark so spreadsheet programs read it as UTF-8.

export type Cell = string | number | null

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

export type CsvRow = Cell[]

/** Saves rows as a CSV file; the byte-order mark lets spreadsheet programs read it as UTF-8. */
export function saveCsv(fileName: string, rows: CsvRow[]): void {
  const blob = new Blob(['\uFEFF', toCsv(rows)], { type: 'text/csv;charset=utf-8' })
  const url = URL.createObjectURL(blob)
  const a = document.createElement('a')
  a.href = url
  a.download = fileName
  document.body.appendChild(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 1000)
}
