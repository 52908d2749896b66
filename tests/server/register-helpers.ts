import type { Test } from 'supertest'
import ExcelJS from 'exceljs'
import Papa from 'papaparse'

/** The response body as bytes, whatever its content type. */
export async function binary(req: Test): Promise<Buffer> {
  const res = await req.buffer(true).parse((r, done) => {
    const chunks: Buffer[] = []
    r.on('data', (c: Buffer) => chunks.push(c))
    r.on('end', () => done(null, Buffer.concat(chunks)))
  })
  if (res.status !== 200) throw new Error(`download failed: ${res.status}`)
  return res.body as Buffer
}

/** The same rows as an XLSX workbook; a cell given as { formula } is written as a real formula. */
export async function xlsxOf(rows: (string | number | { formula: string } | null)[][]): Promise<Buffer> {
  const wb = new ExcelJS.Workbook()
  const sheet = wb.addWorksheet('Strings')
  for (const r of rows) sheet.addRow(r)
  return Buffer.from(await wb.xlsx.writeBuffer())
}

export const csvRows = (text: string) => Papa.parse<string[]>(text, { skipEmptyLines: true }).data
