import { toCsv } from '../overdue/overdue-csv'

type Cell = Parameters<typeof toCsv>[0][number][number]
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
