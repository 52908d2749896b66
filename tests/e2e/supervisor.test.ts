// Supervisor journey in a real browser: ranked queue with score parts → choose work → plan two
// crews → publish; then a crew member sees the published stops on their phone.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { launchBrowser, signIn, startApp, type RunningApp } from './supervisor-helpers'

let app: RunningApp
let browser: Browser
beforeAll(async () => {
  app = await startApp()
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
  await app?.close()
})

// The server's "today" (GET /runs/mine without a date, the crew's /run page) is the UTC date.
const today = new Date().toISOString().slice(0, 10)
const PICK = 8

interface QueueRow {
  id: number
  lat: number | null
  string: { assetTag: string } | null
  site: { accessFrom: string | null } | null
}

describe('supervisor plans and publishes runs', () => {
  let published: { crewName: string; tags: string[] }[] = []

  it('ranks the queue with visible score parts, plans two crews and publishes', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'supervisor@example.org', '/queue')

    await page.getByRole('button', { name: 'Refresh' }).click()
    await page.locator('.queue-item').first().waitFor()

    // Ranked by score, highest first, and each score shown with its three parts as numbers.
    const totals = (await page.locator('.score-bar__total').allTextContents()).map(Number)
    expect(totals.length).toBeGreaterThanOrEqual(PICK)
    // Emergencies come first (a hazard outranks every routine item), then the score decides.
    const severities = await page
      .locator('.queue-item')
      .evaluateAll((els) => els.map((el) => el.getAttribute('data-severity')))
    const rank = (i: number) => (severities[i] === 'emergency' ? 1000 : 0) + totals[i]
    for (let i = 1; i < totals.length; i++) expect(rank(i - 1)).toBeGreaterThanOrEqual(rank(i))
    const legend = await page.locator('.score-bar__legend').first().textContent()
    expect(legend).toMatch(/Risk\s*[\d.]+/)
    expect(legend).toMatch(/Importance\s*[\d.]+/)
    expect(legend).toMatch(/Clock\s*[\d.]+/)
    const parts = (await page.locator('.score-bar__legend').first().locator('strong').allTextContents()).map(
      Number,
    )
    expect(parts.reduce((a, b) => a + b, 0)).toBeCloseTo(totals[0], 0)

    // Choose the top items, plus a few strings that can be visited at any hour (no access window),
    // and take them to planning.
    const open = await page.evaluate(async () => {
      const res = await fetch('/api/v1/queue?state=open', { credentials: 'include' })
      return (await res.json()) as { items: QueueRow[] }
    })
    const placed = open.items.filter((item) => item.lat !== null)
    const anyHour = placed.filter((item) => item.string && !item.site?.accessFrom)
    const picks = [...new Set([...placed.slice(0, PICK - 3), ...anyHour.slice(0, 3)].map((item) => item.id))]
    for (const id of picks) await page.locator(`.queue-item[data-item-id="${id}"] .q-checkbox`).click()
    await expect.poll(() => page.getByText(`${picks.length} selected`).count()).toBe(1)
    await page.getByRole('button', { name: 'Plan these' }).click()
    await page.waitForURL((url) => url.pathname === '/plan' && url.searchParams.has('items'))
    const chosen = new URL(page.url()).searchParams.get('items')!.split(',')
    expect(chosen.map(Number).sort()).toEqual([...picks].sort())

    // Two crews, today; the third crew stays home.
    await page.getByLabel('Date').fill(today)
    await page.getByLabel('Plan crew Lantern').waitFor()
    await page.getByLabel('Plan crew Wick').uncheck()
    await page.getByRole('button', { name: 'Optimise', exact: true }).click()
    const columns = page.locator('.run-column')
    // The plan is worked out on a worker thread; under a loaded test machine that can take seconds.
    await expect.poll(() => columns.count(), { timeout: 20_000 }).toBe(2)
    await expect.poll(() => page.locator('.run-stop').count()).toBeGreaterThan(0)

    // The crew member signing in later belongs to Lantern: make sure Lantern has work, using the
    // "Move to…" button that also serves touch screens.
    // A stop without an access window can move to any shift.
    const lantern = page.locator('.run-column', { hasText: 'Lantern' })
    if ((await lantern.locator('.run-stop__tag').count()) === 0) {
      const movable = page
        .locator('.run-column', { hasText: 'Tallow' })
        .locator('.run-stop', { has: page.locator('.run-stop__tag'), hasNotText: 'access ' })
        .first()
      await movable.getByRole('button', { name: /to another crew/ }).click()
      await page.locator('.q-menu .q-item', { hasText: 'To Lantern' }).click()
      await expect.poll(() => lantern.locator('.run-stop__tag').count()).toBeGreaterThan(0)
    }

    await page.getByRole('button', { name: 'Publish', exact: true }).click()
    await page.locator('.q-dialog').getByRole('button', { name: 'Publish' }).click()
    await page.getByText('Published — crews notified by e-mail.').waitFor()
    await page.screenshot({ path: '/tmp/shots/supervisor/e2e-published.png' })
    expect(await page.getByRole('link', { name: 'Open the run sheet' }).getAttribute('href')).toContain(
      `date=${today}`,
    )

    // What the server saved, read back the way the page reads it.
    const saved = await page.evaluate(async (date) => {
      const res = await fetch(`/api/v1/runs?date=${date}`, { credentials: 'include' })
      return (await res.json()) as {
        runs: { crewName: string; state: string; stops: { assetTag: string | null }[] }[]
      }
    }, today)
    expect(saved.runs.map((r) => r.crewName).sort()).toEqual(expect.arrayContaining(['Lantern', 'Tallow']))
    expect(saved.runs.every((r) => r.state === 'published')).toBe(true)
    published = saved.runs.map((r) => ({
      crewName: r.crewName,
      tags: r.stops.map((s) => s.assetTag).filter((t): t is string => !!t),
    }))
    const shownOnBoard = await lantern.locator('.run-stop__tag').allTextContents()
    expect(published.find((r) => r.crewName === 'Lantern')!.tags).toEqual(shownOnBoard)
    await context.close()

    // Publishing e-mails every member of the crew (the local mail fake keeps a copy).
    let mail
    for (let i = 0; i < 50 && !mail; i++) {
      mail = await app
        .db('caughtMail')
        .where('toAddress', 'crew@example.org')
        .where('subject', 'like', '%Lantern%')
        .first()
      if (!mail) await new Promise((r) => setTimeout(r, 100))
    }
    expect(mail).toBeDefined()
  })

  it("shows the crew member the published stops on tonight's run", async () => {
    const lantern = published.find((r) => r.crewName === 'Lantern')
    expect(lantern?.tags.length).toBeGreaterThan(0)
    const context = await browser.newContext({
      viewport: { width: 390, height: 844 },
      isMobile: true,
      hasTouch: true,
    })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'crew@example.org', '/run')
    await page.waitForLoadState('networkidle')

    // /run belongs to another feature: while it is still a placeholder, check the same data the
    // page will show through the API it uses.
    const placeholder = (await page.getByText(/^Coming with/).count()) > 0
    if (!placeholder) {
      for (const tag of lantern!.tags) await page.getByText(tag, { exact: false }).first().waitFor()
    } else {
      const mine = await page.evaluate(async () => {
        const res = await fetch('/api/v1/runs/mine', { credentials: 'include' })
        return (await res.json()) as {
          run: { crewName: string; stops: { assetTag: string | null }[] } | null
        }
      })
      expect(mine.run?.crewName).toBe('Lantern')
      expect(mine.run!.stops.map((s) => s.assetTag).filter(Boolean)).toEqual(lantern!.tags)
    }
    await page.screenshot({ path: '/tmp/shots/supervisor/e2e-crew-run.png' })
    await context.close()
  })
})
