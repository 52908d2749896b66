// A manager imports a file from the Register page: checks it first, sees the bad rows by row number,
// column and message, then imports for real; in a real browser against the real server and database.
import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, expect, it } from 'vitest'
import { chromium, type Browser } from 'playwright-core'
import { CHROMIUM, CHROMIUM_FLAGS, shot, signIn, startApp, type E2eApp } from './helpers'

const PREFIX = 'IMP-E-'
const FILE = readFileSync(
  new URL('../fixtures/register/two-good-three-bad.csv', import.meta.url),
  'utf8',
).replaceAll('IMP-T-', PREFIX)

let app: E2eApp
let browser: Browser
beforeAll(async () => {
  app = await startApp()
  browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS })
})
afterAll(async () => {
  // Only the strings this test imported (no visits or history hang on them).
  if (app) await app.db('strings').where('assetTag', 'like', `${PREFIX}%`).delete()
  await browser?.close()
  await app?.close()
})

it('a manager imports a file and sees the report of bad rows', async () => {
  const context = await browser.newContext({
    viewport: { width: 1280, height: 900 },
    locale: 'en-GB',
    timezoneId: 'Europe/London',
    serviceWorkers: 'block',
  })
  try {
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'manager@example.org')
    await page.goto(`${app.baseUrl}/register`)
    await page.getByRole('button', { name: 'Import' }).click()
    const dialog = page.getByRole('dialog')
    await dialog.locator('input[type=file]').setInputFiles({
      name: 'strings.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(FILE),
    })
    await dialog.getByRole('button', { name: 'Check the file' }).click()

    const report = dialog.locator('[data-test=import-report]')
    await report.waitFor({ state: 'visible', timeout: 30_000 })
    expect(await report.textContent()).toContain('2 new strings would be created')
    // The fixture's bad rows: unknown type (row 4), no asset tag (row 5), latitude 95 (row 6).
    const bad = dialog.locator('[data-test=import-bad-row]')
    const rows = (await bad.allTextContents()).map((t) => t.replace(/\s+/g, ' '))
    expect(rows.some((t) => t.startsWith('4') && t.includes('typeCode') && t.includes('NO-SUCH-TYPE'))).toBe(
      true,
    )
    expect(rows.some((t) => t.startsWith('5') && t.includes('assetTag'))).toBe(true)
    expect(rows.some((t) => t.startsWith('6') && t.includes('lat'))).toBe(true)
    expect(
      Number((await app.db('strings').where('assetTag', 'like', `${PREFIX}%`).count({ n: '*' }))[0].n),
    ).toBe(0)
    await shot(page, 'register-import-report')

    await dialog.getByRole('button', { name: 'Import for real' }).click()
    await dialog.getByText('Imported.').waitFor({ state: 'visible', timeout: 30_000 })
    expect(
      Number((await app.db('strings').where('assetTag', 'like', `${PREFIX}%`).count({ n: '*' }))[0].n),
    ).toBe(2)

    // The table pages and sorts on the server: a click on "Tag" (sorted A to Z) asks for the last tag first.
    await dialog.getByRole('button', { name: 'Close' }).click()
    await dialog.waitFor({ state: 'hidden' })
    const [{ m: lastTag }] = await app.db('strings').whereNull('archivedAt').max({ m: 'assetTag' })
    const tagHeader = page.getByRole('columnheader', { name: 'Tag' })
    await tagHeader.click()
    const firstTag = page.locator('.register-table tbody tr').first().locator('td').first()
    await expect.poll(() => firstTag.textContent(), { timeout: 20_000 }).toContain(lastTag)
  } finally {
    await context.close()
  }
})
