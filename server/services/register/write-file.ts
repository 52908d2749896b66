// Register files written straight to the response as they are built: CSV in papaparse chunks,
// XLSX through exceljs's streaming writer. Text that a spreadsheet would take for a formula
// (= + - @ tab CR first) gets a leading apostrophe, which the import removes again.
import type { Response } from 'express'
import Papa from 'papaparse'
import ExcelJS from 'exceljs'
import { fileColumns, type FileColumn } from '../../../shared/schemas/register'
import type { FileFormat } from './parse-file'

export type FileRow = Record<FileColumn, string | number | null>

const FORMULA = /^[=+\-@\t\r]/
const neutral = (v: string | number | null) => (typeof v === 'string' && FORMULA.test(v) ? `'${v}` : v)

const contentType: Record<FileFormat, string> = {
  csv: 'text/csv; charset=utf-8',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
}

/** Writes respecting back-pressure, so a slow client holds rows in the database, not in memory. */
function put(res: Response, text: string): Promise<void> | void {
  if (!res.write(text)) return new Promise((ok) => res.once('drain', ok))
}

export async function writeFile(
  res: Response,
  format: FileFormat,
  name: string,
  chunks: AsyncIterable<FileRow[]>,
): Promise<void> {
  res.status(200)
  res.setHeader('Content-Type', contentType[format])
  res.setHeader('Content-Disposition', `attachment; filename="${name}.${format}"`)
  res.setHeader('Cache-Control', 'no-store')
  if (format === 'csv') {
    // A byte-order mark so spreadsheet programs read the file as UTF-8.
    await put(res, '\uFEFF' + Papa.unparse([[...fileColumns]]) + '\r\n')
    for await (const rows of chunks) {
      if (!rows.length) continue
      const lines = rows.map((r) => fileColumns.map((c) => r[c] ?? ''))
      await put(res, Papa.unparse(lines, { escapeFormulae: true, newline: '\r\n' }) + '\r\n')
    }
    res.end()
    return
  }
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({
    stream: res,
    useSharedStrings: false,
    useStyles: false,
  })
  const sheet = wb.addWorksheet('Register')
  sheet.addRow([...fileColumns]).commit()
  for await (const rows of chunks)
    for (const r of rows) sheet.addRow(fileColumns.map((c) => neutral(r[c]))).commit()
  sheet.commit()
  await wb.commit()
}
