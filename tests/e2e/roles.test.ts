// Every role lands on its own home after signing in, and a member of the public can report a fault
// and follow it without an account: in a real browser against the real server and database.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { chromium, type Browser, type BrowserContext } from 'playwright-core'
import { reportStateLabel } from '../../shared/vocab/reports'
import { CHROMIUM, CHROMIUM_FLAGS, PHONE, shot, signIn, startApp, type E2eApp } from './helpers'

// Homes as the product brief sets them (handbook product-brief.md, "Screens by role"); titles are the
// page headings each home shows.
const HOMES = [
  { role: 'crew', path: '/run', heading: "Tonight's run" },
  { role: 'supervisor', path: '/queue', heading: 'Queue' },
  { role: 'manager', path: '/overdue', heading: 'Overdue' },
  { role: 'safety', path: '/isolations', heading: 'Isolations' },
  { role: 'admin', path: '/users', heading: 'Users' },
] as const

// References look like LW-7K3QD (product-brief.md, "Words").
const REF = /^LW-[0-9A-Z]{5}$/

let app: E2eApp
let browser: Browser
const refsMade: string[] = []

beforeAll(async () => {
  app = await startApp()
  browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS })
})
afterAll(async () => {
  // The report came from this test only: remove it (its queue item goes with it, ON DELETE CASCADE).
  if (app && refsMade.length) await app.db('reports').whereIn('ref', refsMade).delete()
  await browser?.close()
  await app?.close()
})

async function freshContext(viewport = { width: 1280, height: 800 }): Promise<BrowserContext> {
  return browser.newContext({
    viewport,
    locale: 'en-GB',
    timezoneId: 'Europe/London',
    serviceWorkers: 'block',
  })
}

describe('each role lands on its own home', () => {
  for (const home of HOMES) {
    it(`${home.role} signs in and sees ${home.path}`, async () => {
      const context = await freshContext()
      try {
        const page = await context.newPage()
        await signIn(page, app.baseUrl, `${home.role}@example.org`)
        await page.waitForURL((u) => u.pathname === home.path, { timeout: 20_000 })
        expect(new URL(page.url()).pathname).toBe(home.path)
        const heading = page.getByRole('heading', { level: 1, name: home.heading, exact: true }).first()
        await heading.waitFor({ state: 'visible', timeout: 20_000 })
        expect(await heading.isVisible()).toBe(true)
        await shot(page, `roles-${home.role}`)
      } finally {
        await context.close()
      }
    })
  }
})

describe('public fault report', () => {
  it('reports a fault without an account, gets an LW- reference and checks it', async () => {
    const context = await freshContext(PHONE)
    try {
      const page = await context.newPage()
      const tag = (await app.db('strings').orderBy('id').first('assetTag')).assetTag as string
      await page.goto(`${app.baseUrl}/report?tag=${encodeURIComponent(tag)}`)

      // Nobody is signed in: the page stays public and the label's number is already filled in.
      await page.getByRole('heading', { level: 1, name: 'Report a fault' }).waitFor()
      expect(new URL(page.url()).pathname).toBe('/report')
      const tagInput = page.getByLabel('The number on the lights (if you can see it)')
      expect(await tagInput.inputValue()).toBe(tag)

      // Too little said: the form explains and keeps what was typed.
      await page.getByLabel('What is wrong?').fill('Dim')
      await page.getByRole('button', { name: 'Send report' }).click()
      await page.getByText('Tell us a little about the fault.').waitFor()
      expect(await tagInput.inputValue()).toBe(tag)

      // Saying it is dangerous brings up the advice to keep clear.
      await page.getByRole('switch', { name: /Is anything dangerous/ }).click()
      await page
        .getByText('If there is immediate danger, keep clear and call the emergency services.')
        .waitFor()
      await page.getByRole('switch', { name: /Is anything dangerous/ }).click()

      await page
        .getByLabel('What is wrong?')
        .fill('Several lamps out near the middle of the string (browser test).')
      // A person takes longer than the form's 3 s minimum fill time (a faster post is treated as a robot's).
      await page.waitForTimeout(3_100)
      await page.getByRole('button', { name: 'Send report' }).click()
      const refText = page.getByTestId('report-ref')
      await refText.waitFor({ timeout: 20_000 })
      const ref = (await refText.innerText()).trim()
      refsMade.push(ref)
      expect(ref).toMatch(REF)
      await page.getByText('Keep this to check progress.').waitFor()
      await shot(page, 'roles-report-sent')

      // The report reached the database against the tagged string.
      const row = await app.db('reports').where({ ref }).first('tagText', 'state')
      expect(row).toMatchObject({ tagText: tag, state: 'received' })

      // Checking by reference, as someone would days later, typed loosely.
      await page.goto(`${app.baseUrl}/report`)
      await page.getByRole('tab', { name: 'Check a report' }).click()
      await page.getByLabel('Your reference').fill(ref.toLowerCase().replace('-', ' '))
      await page.getByRole('button', { name: 'Check', exact: true }).click()
      const status = page.getByTestId('report-status')
      await status.waitFor({ timeout: 20_000 })
      expect(await status.innerText()).toContain(ref)
      // A new report is in its first state, under the label the server gives it.
      expect(await status.getByRole('heading').innerText()).toBe(reportStateLabel.received)
      await shot(page, 'roles-report-status')
    } finally {
      await context.close()
    }
  })
})
