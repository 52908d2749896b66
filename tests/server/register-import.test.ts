// Importing the register from a CSV and an XLSX: dry run, for real, again; bad rows reported by row,
// field and code; formulas kept as text; strict mode; the row cap.
import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { csvRows, xlsxOf } from './register-helpers'

let t: TestApp
let manager: string
beforeAll(async () => {
  t = await makeTestApp()
  manager = `Bearer ${await t.token('manager')}`
})
afterAll(async () => {
  // Only the strings these tests made (no visits or history hang on them).
  await t.db('strings').where('assetTag', 'like', 'IMP-%').delete()
  await t.close()
})

const FIXTURE = readFileSync(new URL('../fixtures/register/two-good-three-bad.csv', import.meta.url), 'utf8')
const FORMULA = '=HYPERLINK("http://example.org","x")'

/** The fixture with its tags moved to their own prefix, so each test has strings of its own. */
const fixture = (prefix: string) => FIXTURE.replaceAll('IMP-T-', prefix)

function send(file: Buffer | string, name: string, fields: { dryRun: string; mode?: string }) {
  return request(t.app)
    .post('/api/v1/register/import')
    .set('Authorization', manager)
    .field('dryRun', fields.dryRun)
    .field('mode', fields.mode ?? 'upsert')
    .attach('file', Buffer.from(file), name)
}

const countTags = async (prefix: string) =>
  Number((await t.db('strings').where('assetTag', 'like', `${prefix}%`).count({ n: '*' }))[0].n)

/** The fixture's three bad rows: spreadsheet row numbers, the header being row 1. */
function expectBadRows(rejected: { row: number; errors: { field: string; code: string }[] }[]) {
  expect(rejected.map((r) => r.row)).toEqual([4, 5, 6])
  expect(rejected[0].errors).toContainEqual(
    expect.objectContaining({ field: 'typeCode', code: 'unknown_type' }),
  )
  expect(rejected[1].errors).toContainEqual(expect.objectContaining({ field: 'assetTag', code: 'required' }))
  // Latitude is at most 90° (WGS 84).
  expect(rejected[2].errors).toContainEqual(expect.objectContaining({ field: 'lat', code: 'out_of_range' }))
  for (const r of rejected) for (const e of r.errors) expect(e).toHaveProperty('message')
}

describe.each([
  ['csv', 'IMP-C-'],
  ['xlsx', 'IMP-X-'],
] as const)('importing a %s file', (format, prefix) => {
  async function file(): Promise<Buffer> {
    const text = fixture(prefix)
    if (format === 'csv') return Buffer.from(text)
    // The name cell becomes a real XLSX formula, which must be kept as its text.
    return xlsxOf(csvRows(text).map((r) => r.map((c) => (c === FORMULA ? { formula: c.slice(1) } : c))))
  }

  it('reports the bad rows in a dry run and writes nothing', async () => {
    const res = await send(await file(), `strings.${format}`, { dryRun: 'true' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ dryRun: true, written: false, created: 2, updated: 0, unchanged: 0 })
    expectBadRows(res.body.rejected)
    expect(await countTags(prefix)).toBe(0)
  })

  it('creates the good rows for real, then finds them all unchanged', async () => {
    const real = await send(await file(), `strings.${format}`, { dryRun: 'false' })
    expect(real.body).toMatchObject({ written: true, created: 2, updated: 0, unchanged: 0 })
    expectBadRows(real.body.rejected)
    expect(await countTags(prefix)).toBe(2)
    const audit = await t.db('auditLog').where({ action: 'register.import' }).orderBy('id', 'desc').first()
    expect(audit.details).toMatchObject({ created: 2, updated: 0 })

    const again = await send(await file(), `strings.${format}`, { dryRun: 'false' })
    expect(again.body).toMatchObject({ created: 0, updated: 0, unchanged: 2 })
    expect(await countTags(prefix)).toBe(2)
  })

  it('keeps a formula as text and takes a line’s middle vertex as its point', async () => {
    const s = await t
      .db('strings')
      .where({ assetTag: `${prefix}002` })
      .first()
    expect(s.name).toBe(FORMULA)
    expect(s.geometry).toBe('line')
    expect([s.lng, s.lat]).toEqual([-2.2741, 54.0712])
    const one = await t
      .db('strings')
      .where({ assetTag: `${prefix}001` })
      .first()
    expect(Number(one.mountingHeightM)).toBe(5.5)
    expect(one.installedOn).toBe('2026-11-01')
  })
})

describe('import rules', () => {
  it('updates a changed row and bumps its version', async () => {
    const text = fixture('IMP-U-')
    await send(text, 'u.csv', { dryRun: 'false' })
    const before = await t.db('strings').where({ assetTag: 'IMP-U-001' }).first()
    const res = await send(text.replace('Import test point', 'Renamed point'), 'u.csv', { dryRun: 'false' })
    expect(res.body).toMatchObject({ created: 0, updated: 1, unchanged: 1 })
    const after = await t.db('strings').where({ assetTag: 'IMP-U-001' }).first()
    expect(after.name).toBe('Renamed point')
    expect(after.version).toBe(before.version + 1)
  })

  it('writes nothing in strict mode when one row fails', async () => {
    const res = await send(fixture('IMP-S-'), 's.csv', { dryRun: 'false', mode: 'strict' })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ mode: 'strict', written: false })
    expect(res.body.rejected).toHaveLength(3)
    expect(await countTags('IMP-S-')).toBe(0)
  })

  it('rejects a number written as a formula', async () => {
    const text = fixture('IMP-F-').replace('54.0712,-2.2741,,5.5', '=1+53,-2.2741,,5.5')
    const res = await send(text, 'f.csv', { dryRun: 'true' })
    expect(res.body.rejected[0]).toMatchObject({ row: 2, errors: [{ field: 'lat', code: 'not_a_number' }] })
  })

  it('answers a missing file, missing columns and too many rows with their codes', async () => {
    const none = await request(t.app)
      .post('/api/v1/register/import')
      .set('Authorization', manager)
      .field('dryRun', 'true')
    expect(none.status).toBe(400)
    expect(none.body.error.code).toBe('missing_file')
    const noTag = await send('name,typeCode\nx,y\n', 'n.csv', { dryRun: 'true' })
    expect(noTag.status).toBe(400)
    expect(noTag.body.error.code).toBe('missing_columns')
    // One row over the cap of 50,000 (read on a pool thread: the file is over the inline size).
    const big = 'assetTag\n' + Array.from({ length: 50_001 }, (_, i) => `B${i}`).join('\n')
    const tooMany = await send(big, 'big.csv', { dryRun: 'true' })
    expect(tooMany.status).toBe(413)
    expect(tooMany.body.error).toMatchObject({ code: 'too_large', details: { limit: 50_000, cost: 50_001 } })
  })

  it('is for managers only', async () => {
    const res = await request(t.app)
      .post('/api/v1/register/import')
      .set('Authorization', `Bearer ${await t.token('supervisor')}`)
      .field('dryRun', 'true')
      .attach('file', Buffer.from(FIXTURE), 'x.csv')
    expect(res.status).toBe(403)
  })
})
