// The Register area in a real browser: a manager creates a client and a site; a supervisor puts a
// new user on a crew, who then sees their crew instead of "whom to ask" (issue 10 items 1 and 6).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { mkdir } from 'node:fs/promises'
import type { Browser, Page } from 'playwright-core'
import { launchBrowser, signIn, startApp, type RunningApp } from './supervisor-helpers'

let app: RunningApp
let browser: Browser
beforeAll(async () => {
  app = await startApp()
  browser = await launchBrowser()
  await mkdir(SHOTS, { recursive: true })
})
afterAll(async () => {
  await browser?.close()
  await app?.close()
})

const SHOTS = process.env.E2E_SHOTS ?? 'uploads/test/shots'
const run = Date.now().toString(36)

/** A form field's text box (Quasar puts the test id on the native input itself). */
const field = (page: Page, testId: string) =>
  page.locator(`input[data-testid="${testId}"], [data-testid="${testId}"] input`).first()

async function pickOption(page: Page, testId: string, option: string | RegExp): Promise<void> {
  await page.getByTestId(testId).click()
  await page.getByRole('option', { name: option }).first().click()
}

describe('Register area', () => {
  it('a manager creates a client and then a site for it', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'manager@example.org', '/overdue')
    await page.goto(`${app.baseUrl}/estate/clients`)
    await page.getByTestId('estate-table').waitFor()
    await page.screenshot({ path: `${SHOTS}/estate-clients-1280.png` })

    const client = `Harbour Trust ${run}`
    await page.getByTestId('estate-new').click()
    await field(page, 'field-name').fill(client)
    await field(page, 'field-timeZone').fill('Mars/Olympus')
    await page.getByRole('button', { name: 'Create client' }).click()
    // A wrong zone is said under its field; nothing is saved.
    await expect.poll(() => page.getByText('Use an IANA time-zone name').count()).toBeGreaterThan(0)
    await field(page, 'field-timeZone').fill('Europe/London')
    await page.getByRole('button', { name: 'Create client' }).click()
    await page.getByRole('cell', { name: client, exact: true }).waitFor()
    const stored = await app.db('clients').where({ name: client }).first('id', 'timeZone')
    expect(stored.timeZone).toBe('Europe/London')

    await page.goto(`${app.baseUrl}/estate/sites`)
    await page.getByTestId('estate-new').click()
    await pickOption(page, 'field-clientId', client)
    await field(page, 'field-name').fill('Quayside')
    const map = page.getByTestId('point-picker')
    await map.waitFor()
    await page.waitForTimeout(400)
    await map.click({ position: { x: 120, y: 100 } })
    await page.screenshot({ path: `${SHOTS}/estate-site-dialog-1280.png` })
    await page.getByRole('button', { name: 'Create site' }).click()
    await page.getByRole('cell', { name: 'Quayside' }).first().waitFor()
    const site = await app.db('sites').where({ clientId: stored.id, name: 'Quayside' }).first('lat', 'lng')
    expect(typeof site.lat).toBe('number')
    await context.close()
  })

  it('a manager edits a string from its page on a phone, drawing it as a line', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'manager@example.org', '/overdue')
    const s = await app
      .db('strings')
      .where({ geometry: 'point' })
      .whereNull('archivedAt')
      .orderBy('id')
      .first('id', 'version')
    await page.goto(`${app.baseUrl}/strings/${s.id}`)
    await page.getByTestId('edit-string').click()
    await field(page, 'field-name').fill(`Renamed ${run}`)
    await pickOption(page, 'field-geometry', /A line/)
    const map = page.getByTestId('point-picker')
    await map.scrollIntoViewIfNeeded()
    await page.waitForTimeout(400)
    await map.click({ position: { x: 80, y: 120 } })
    await map.click({ position: { x: 220, y: 140 } })
    await page.screenshot({ path: `${SHOTS}/string-dialog-390.png` })
    await page.getByRole('button', { name: 'Save changes' }).click()
    await page.getByText(`Renamed ${run}`).first().waitFor()
    const saved = await app.db('strings').where({ id: s.id }).first('name', 'geometry', 'line', 'version')
    expect(saved).toMatchObject({ name: `Renamed ${run}`, geometry: 'line', version: s.version + 1 })
    const line = typeof saved.line === 'string' ? JSON.parse(saved.line) : saved.line
    expect(line).toHaveLength(2)
    await page.screenshot({ path: `${SHOTS}/string-page-390.png` })
    await context.close()
  })

  it('a supervisor adds a new user to a crew, who then sees that crew on the run page', async () => {
    const hash = (await app.db('users').where({ email: 'crew@example.org' }).first('passwordHash'))
      .passwordHash
    const email = `starter.${run}@example.org`
    const [userId] = await app
      .db('users')
      .insert({ email, name: `Sam Starter ${run}`, role: 'crew', passwordHash: hash, active: true })

    // Before: the new crew member is told whom to ask.
    const phone = await browser.newContext({ viewport: { width: 390, height: 844 } })
    const crewPage = await phone.newPage()
    await signIn(crewPage, app.baseUrl, email, '/run')
    await crewPage.getByTestId('run-no-crew').waitFor()
    expect(await crewPage.getByTestId('run-no-crew').textContent()).toMatch(/Ask .+ to add you to a crew/)
    await crewPage.screenshot({ path: `${SHOTS}/run-no-crew-390.png` })

    const context = await browser.newContext({ viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'supervisor@example.org', '/queue')
    await page.goto(`${app.baseUrl}/estate/crews`)
    await page.getByRole('button', { name: 'Edit' }).first().waitFor()
    await page.screenshot({ path: `${SHOTS}/estate-crews-390.png` })
    await page.getByRole('button', { name: 'Edit' }).first().click()
    await pickOption(page, 'field-memberIds', new RegExp(`Sam Starter ${run}`))
    await page.keyboard.press('Escape')
    await page.screenshot({ path: `${SHOTS}/estate-crew-dialog-390.png` })
    await page.getByRole('button', { name: 'Save changes' }).click()
    await expect
      .poll(async () => (await app.db('users').where({ id: userId }).first('crewId')).crewId)
      .not.toBeNull()
    await context.close()

    await crewPage.reload()
    await crewPage.locator('.run-page').waitFor()
    await expect.poll(() => crewPage.getByTestId('run-no-crew').count()).toBe(0)
    await phone.close()
  })
})
