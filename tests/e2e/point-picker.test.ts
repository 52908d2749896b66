// The estate form's map picker draws the same basemap as the map page: in demo mode the town's
// drawn streets, opened on the town when the new record has no point yet.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { mkdir } from 'node:fs/promises'
import type { Browser } from 'playwright-core'
import { launchBrowser, signIn, startApp, type RunningApp } from './supervisor-helpers'

const SHOTS = process.env.E2E_SHOTS ?? 'uploads/test/shots'

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

describe('Point picker basemap', () => {
  it('shows the demo town on the site form and on the map page, on a phone', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'manager@example.org', '/overdue')

    await page.goto(`${app.baseUrl}/estate/sites`)
    await page.getByTestId('estate-new').click()
    const picker = page.getByTestId('point-picker')
    await picker.scrollIntoViewIfNeeded()
    // Streets are drawn, and some of them inside the picker's visible box (the map opened on the town).
    await expect.poll(() => picker.locator('path.lw-map-street').count()).toBeGreaterThan(0)
    const box = (await picker.boundingBox())!
    const inView = await picker.locator('path.lw-map-street').evaluateAll(
      (paths, b) =>
        paths.filter((p) => {
          const r = p.getBoundingClientRect()
          return r.right > b.x && r.left < b.x + b.width && r.bottom > b.y && r.top < b.y + b.height
        }).length,
      box,
    )
    expect(inView).toBeGreaterThan(0)
    await expect.poll(() => picker.getByText('Lampwright demo basemap').count()).toBe(1)
    await picker.evaluate((el) => el.scrollIntoView({ block: 'center' }))
    await page.waitForTimeout(400)
    await page.screenshot({ path: `${SHOTS}/estate-site-picker-390.png` })

    // The map page still draws the same streets through the same component.
    await page.goto(`${app.baseUrl}/map`)
    await expect.poll(() => page.locator('.lw-map path.lw-map-street').count()).toBeGreaterThan(0)
    await context.close()
  })
})
