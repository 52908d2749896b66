// A register file (CSV or XLSX) read into rows of text cells keyed by column. Pure: runs on a pool
// thread. Nothing in a cell is ever evaluated; an XLSX formula is read as its text.
import Papa from 'papaparse'
import ExcelJS from 'exceljs'
import { fileColumns, IMPORT_MAX_ROWS, type FileColumn } from '../../../shared/schemas/register'

export type FileFormat = 'csv' | 'xlsx'
export type RawRow = Partial<Record<FileColumn, string>>

export class FileProblem extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status = 400,
    readonly details?: unknown,
  ) {
    super(message)
  }
}

const known = new Map(fileColumns.map((c) => [c.toLowerCase(), c]))

/** Maps header cells to columns; the asset tag column is the one that cannot be missing. */
function headerMap(header: string[]): (FileColumn | null)[] {
  const cols = header.map(
    (h) =>
      known.get(
        String(h ?? '')
          .trim()
          .toLowerCase(),
      ) ?? null,
  )
  if (!cols.includes('assetTag'))
    throw new FileProblem(
      'missing_columns',
      `The first row must name the columns; "assetTag" is missing. Expected: ${fileColumns.join(', ')}.`,
    )
  return cols
}

function checkCount(n: number): void {
  if (n > IMPORT_MAX_ROWS)
    throw new FileProblem(
      'too_large',
      `The file has ${n} rows; at most ${IMPORT_MAX_ROWS} can be imported at once. Split it into smaller files.`,
      413,
      { limit: IMPORT_MAX_ROWS, cost: n },
    )
}

function toRows(lines: string[][]): { row: number; cells: RawRow }[] {
  const [header, ...body] = lines
  if (!header) throw new FileProblem('empty_file', 'The file is empty.')
  const cols = headerMap(header)
  checkCount(body.length)
  const out: { row: number; cells: RawRow }[] = []
  body.forEach((line, i) => {
    if (line.every((c) => c === '')) return
    const cells: RawRow = {}
    cols.forEach((col, j) => {
      if (col) cells[col] = line[j] ?? ''
    })
    out.push({ row: i + 2, cells })
  })
  return out
}

function parseCsv(bytes: Uint8Array): string[][] {
  const text = new TextDecoder('utf-8').decode(bytes).replace(/^\uFEFF/, '')
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: 'greedy', dynamicTyping: false })
  return parsed.data
}

/** An XLSX cell as text: dates as days, formulas as their text (never their cached result). */
function cellText(v: ExcelJS.CellValue): string {
  if (v == null) return ''
  if (v instanceof Date) return v.toISOString().slice(0, 10)
  if (typeof v === 'object') {
    if ('formula' in v && v.formula) return `=${v.formula}`
    if ('sharedFormula' in v && v.sharedFormula) return `=${v.sharedFormula}`
    if ('richText' in v) return v.richText.map((t) => t.text).join('')
    if ('text' in v) return String(v.text)
    if ('error' in v) return String(v.error)
    return ''
  }
  return String(v)
}

async function parseXlsx(bytes: Uint8Array): Promise<string[][]> {
  const wb = new ExcelJS.Workbook()
  try {
    await wb.xlsx.load(bytes as unknown as ArrayBuffer)
  } catch {
    throw new FileProblem('invalid_file', 'The file could not be read as an XLSX workbook.')
  }
  const sheet = wb.worksheets[0]
  if (!sheet) throw new FileProblem('empty_file', 'The workbook has no sheet.')
  checkCount(sheet.rowCount - 1)
  const lines: string[][] = []
  for (let r = 1; r <= sheet.rowCount; r++) {
    // row.values counts from 1; index 0 is always empty.
    const values = sheet.getRow(r).values as ExcelJS.CellValue[]
    lines.push(Array.isArray(values) ? values.slice(1).map(cellText) : [])
  }
  return lines
}

export async function parseFile(bytes: Uint8Array, format: FileFormat) {
  return toRows(format === 'csv' ? parseCsv(bytes) : await parseXlsx(bytes))
}
