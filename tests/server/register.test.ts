// The register at scale: server-side pages, sorting, filters; the template; the streamed export and
// its round trip through the import.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import ExcelJS from 'exceljs'
import Papa from 'papaparse'
import { makeTestApp, type TestApp } from './helpers'
import { binary } from './register-helpers'

let t: TestApp
let manager: string
beforeAll(async () => {
  t = await makeTestApp()
  manager = `Bearer ${await t.token('manager')}`
})
afterAll(() => t.close())

const COLUMNS = [
  'assetTag',
  'name',
  'typeCode',
  'siteName',
  'circuitRef',
  'structureRef',
  'geometry',
  'lat',
  'lng',
  'line',
  'mountingHeightM',
  'installedOn',
]

const page = (qs: string) => request(t.app).get(`/api/v1/register?${qs}`).set('Authorization', manager)
const liveStrings = async () => Number((await t.db('strings').whereNull('archivedAt').count({ n: '*' }))[0].n)

describe('register pages', () => {
  it('answers one page and the total over all pages', async () => {
    const total = await liveStrings()
    const first = await page('pageSize=25')
    expect(first.status).toBe(200)
    expect(first.body.items).toHaveLength(25)
    expect(first.body.total).toBe(total)
    const last = await page(`pageSize=25&page=${Math.ceil(total / 25)}`)
    expect(last.body.items).toHaveLength(total - 25 * (Math.ceil(total / 25) - 1))
    // Pages never overlap: every string appears once across all pages.
    const seen = new Set<number>()
    for (let p = 1; p <= Math.ceil(total / 200); p++) {
      const res = await page(`pageSize=200&page=${p}&sort=status`)
      for (const s of res.body.items) seen.add(s.id)
    }
    expect(seen.size).toBe(total)
  })

  it('sorts by asset tag both ways and by state in order of urgency', async () => {
    const asc = (await page('sort=assetTag&dir=asc&pageSize=200')).body.items.map(
      (s: { assetTag: string }) => s.assetTag,
    )
    // MariaDB's default collation compares case-insensitively; the demo tags are upper case.
    expect(asc).toEqual([...asc].sort())
    const desc = await page('sort=assetTag&dir=desc&pageSize=5')
    const [maxTag] = (await t.db('strings').whereNull('archivedAt').max({ m: 'assetTag' })).map((r) => r.m)
    expect(desc.body.items[0].assetTag).toBe(maxTag)
    const order = ['lit', 'watch', 'replace', 'dark', 'safe']
    const byState = (await page('sort=status&pageSize=200')).body.items.map((s: { status: string }) =>
      order.indexOf(s.status),
    )
    expect(byState).toEqual([...byState].sort((a: number, b: number) => a - b))
    const worst = (await page('sort=status&dir=desc&pageSize=1')).body.items[0].status
    const worstInDb = (await t.db('strings').whereNull('archivedAt').distinct('status')).map((r) => r.status)
    expect(worst).toBe(order.filter((s) => worstInDb.includes(s)).pop())
  })

  it('sorts by every shown column, one string per row on each page', async () => {
    const total = await liveStrings()
    for (const sort of [
      'name',
      'lampsOut',
      'type',
      'site',
      'client',
      'circuit',
      'structure',
      'installedOn',
      'lastVisitAt',
      'forecastDarkAt',
    ]) {
      const a = await page(`sort=${sort}&pageSize=200`)
      expect(a.status, `${sort}: ${JSON.stringify(a.body).slice(0, 300)}`).toBe(200)
      const b = await page(`sort=${sort}&pageSize=200&page=2`)
      const ids = new Set([...a.body.items, ...b.body.items].map((s: { id: number }) => s.id))
      expect(ids.size).toBe(Math.min(400, total))
    }
    const bySite = (await page('sort=site&pageSize=200')).body.items.map(
      (s: { siteName: string }) => s.siteName,
    )
    expect(bySite).toEqual(
      [...bySite].sort((x: string, y: string) => x.localeCompare(y, 'en', { sensitivity: 'base' })),
    )
  })

  it('filters by state and search and counts the matches', async () => {
    const dark = await page('status=dark&pageSize=200')
    const darkInDb = Number(
      (await t.db('strings').whereNull('archivedAt').where('status', 'dark').count({ n: '*' }))[0].n,
    )
    expect(dark.body.total).toBe(darkInDb)
    expect(dark.body.items.every((s: { status: string }) => s.status === 'dark')).toBe(true)
    const hs = await page('q=WF-HS-01')
    expect(hs.body.total).toBeGreaterThan(0)
    expect(hs.body.items.every((s: { assetTag: string }) => s.assetTag.startsWith('WF-HS-01'))).toBe(true)
  })

  it('refuses a sort column it does not know, and the crew', async () => {
    const bad = await page('sort=password')
    expect(bad.status).toBe(400)
    expect(bad.body.error.code).toBe('validation_failed')
    const crew = await request(t.app)
      .get('/api/v1/register')
      .set('Authorization', `Bearer ${await t.token('crew')}`)
    expect(crew.status).toBe(403)
  })
})

describe('template', () => {
  it('gives the columns with one example row, as CSV and as XLSX', async () => {
    const csv = await request(t.app).get('/api/v1/register/template?format=csv').set('Authorization', manager)
    expect(csv.status).toBe(200)
    expect(csv.headers['content-type']).toMatch(/text\/csv/)
    const rows = Papa.parse<string[]>(csv.text.replace(/^\uFEFF/, ''), { skipEmptyLines: true }).data
    expect(rows[0]).toEqual(COLUMNS)
    expect(rows).toHaveLength(2)
    const xlsx = await binary(
      request(t.app).get('/api/v1/register/template?format=xlsx').set('Authorization', manager),
    )
    const wb = new ExcelJS.Workbook()
    await wb.xlsx.load(xlsx as unknown as ArrayBuffer)
    const sheet = wb.worksheets[0]
    expect((sheet.getRow(1).values as unknown[]).slice(1)).toEqual(COLUMNS)
    expect(sheet.rowCount).toBe(2)
  })
})

describe('export', () => {
  it('streams the filtered register with formulas neutralised, and imports back unchanged', async () => {
    const dark = Number(
      (await t.db('strings').whereNull('archivedAt').where('status', 'dark').count({ n: '*' }))[0].n,
    )
    const csv = await request(t.app)
      .get('/api/v1/register/export?format=csv&status=dark')
      .set('Authorization', manager)
    expect(csv.status).toBe(200)
    const rows = Papa.parse<string[]>(csv.text.replace(/^\uFEFF/, ''), { skipEmptyLines: true }).data
    expect(rows).toHaveLength(dark + 1)
    // Every line's text starts with a neutralising apostrophe when it begins with "-" (a longitude).
    const lineCol = COLUMNS.indexOf('line')
    expect(rows.slice(1).every((r) => r[lineCol] === '' || !/^[=+\-@]/.test(r[lineCol]))).toBe(true)

    for (const format of ['csv', 'xlsx'] as const) {
      const file = await binary(
        request(t.app).get(`/api/v1/register/export?format=${format}`).set('Authorization', manager),
      )
      const res = await request(t.app)
        .post('/api/v1/register/import')
        .set('Authorization', manager)
        .field('dryRun', 'false')
        .field('mode', 'strict')
        .attach('file', file, `register.${format}`)
      expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(200)
      expect(res.body).toMatchObject({ created: 0, updated: 0, unchanged: await liveStrings(), rejected: [] })
    }
  })
})
