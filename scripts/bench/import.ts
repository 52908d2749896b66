// Benchmark: importing 20,000 new strings from a CSV through the real HTTP API (parsed and checked
// on the worker pool, written in batches), then the same file again (all unchanged), then the same
// rows as XLSX in a dry run. Target (issue 10): each under 20 s.
import ExcelJS from 'exceljs'
import Papa from 'papaparse'
import { fileColumns } from '../../shared/schemas/register'
import { siteKey } from '../../server/services/register/lookups'
import { closeWorkers } from '../../server/workers/pool'
import { openBenchApp } from './large-estate'

const ROWS = 20_000
const TARGET_S = 20
const bench = await openBenchApp(0)
try {
  const token = await bench.token('manager@example.org')
  const types = (await bench.knex('stringTypes').select('code')).map((t) => t.code as string)
  const sites = await bench
    .knex('sites as si')
    .join('clients as c', 'c.id', 'si.clientId')
    .select('si.name', 'c.name as client')
  const circuits = (await bench.knex('circuits').select('ref')).map((c) => c.ref as string)
  const rows = Array.from({ length: ROWS }, (_, i) => {
    const site = sites[i % sites.length]
    const lng = -2.3 + (i % 200) * 0.001
    const lat = 54 + Math.floor(i / 200) * 0.001
    return [
      `BENCH-${String(i).padStart(5, '0')}`,
      `Bench string ${i}`,
      types[i % types.length],
      siteKey(site.client, site.name),
      circuits[i % circuits.length],
      '',
      i % 3 ? 'point' : 'line',
      lat,
      lng,
      i % 3 ? '' : `${lng - 0.0002} ${lat};${lng + 0.0002} ${lat}`,
      5,
      '2026-11-01',
    ]
  })
  const csv = Papa.unparse([[...fileColumns], ...rows])
  const wb = new ExcelJS.Workbook()
  const sheet = wb.addWorksheet('Strings')
  sheet.addRow([...fileColumns])
  for (const r of rows) sheet.addRow(r)
  const xlsx = Buffer.from(await wb.xlsx.writeBuffer())

  async function run(file: Blob, name: string, dryRun: boolean) {
    const form = new FormData()
    form.set('dryRun', String(dryRun))
    form.set('mode', 'upsert')
    form.set('file', file, name)
    const t0 = performance.now()
    const res = await fetch(`${bench.base}/register/import`, {
      method: 'POST',
      headers: { authorization: `Bearer ${token}` },
      body: form,
    })
    const body = (await res.json()) as {
      created: number
      updated: number
      unchanged: number
      rejected: unknown[]
    }
    if (res.status !== 200) throw new Error(`import answered ${res.status}: ${JSON.stringify(body)}`)
    return { s: (performance.now() - t0) / 1000, ...body }
  }
  const results = [
    ['CSV, new strings', await run(new Blob([csv]), 'bench.csv', false)],
    ['CSV again', await run(new Blob([csv]), 'bench.csv', false)],
    ['XLSX, dry run', await run(new Blob([xlsx]), 'bench.xlsx', true)],
  ] as const
  console.log('| import | rows | MB | created | unchanged | rejected | seconds | target s | ok |')
  console.log('| --- | --- | --- | --- | --- | --- | --- | --- | --- |')
  for (const [label, r] of results) {
    const mb = (label.startsWith('XLSX') ? xlsx.length : csv.length) / 1024 / 1024
    console.log(
      `| ${label} | ${ROWS} | ${mb.toFixed(1)} | ${r.created} | ${r.unchanged} | ${r.rejected.length} | ${r.s.toFixed(1)} | ${TARGET_S} | ${r.s < TARGET_S ? 'yes' : 'NO'} |`,
    )
  }
} finally {
  await closeWorkers()
  await bench.close()
}
