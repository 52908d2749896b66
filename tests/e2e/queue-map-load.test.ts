// The load budget's client side (issue 13 part 7) in a real browser: the queue shows one page at a
// time with its filters and page in the address, and the map draws the server's groups at district
// zoom and single strings at street zoom.
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

describe('queue pages and map groups', () => {
  it('keeps the queue filter and page in the address and counts every item', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'supervisor@example.org', '/queue')
    // The kind with the most open items in the demo town.
    const [top] = (await app
      .db('queueItems')
      .where({ state: 'open' })
      .groupBy('kind')
      .select('kind', app.db.raw('count(*) as n'))
      .orderBy('n', 'desc')) as { kind: string; n: number }[]
    const kind = top.kind
    const open = Number(top.n)
    await page.goto(`${app.baseUrl}/queue?kind=${kind}`)
    await page.locator('.queue-item').first().waitFor()
    await expect.poll(() => page.getByText(`of ${open}`).count()).toBe(1)
    expect(new URL(page.url()).searchParams.get('kind')).toBe(kind)
    // Every item on the page is of the kind in the address.
    const res = await page.evaluate(async (k) => {
      const r = await fetch(`/api/v1/queue?kind=${k}&pageSize=100`, { credentials: 'include' })
      return (await r.json()) as { total: number; items: { kind: string }[] }
    }, kind)
    expect(res.total).toBe(open)
    expect(res.items.every((i) => i.kind === kind)).toBe(true)
    await page.screenshot({ path: '.test-data-e/queue-page-390.png' })
    await context.close()
  })

  it('draws groups when zoomed out and single strings when zoomed in', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } })
    const page = await context.newPage()
    await signIn(page, app.baseUrl, 'crew@example.org', '/run')
    const answers: { zoom: number; clusters: number; items: number }[] = []
    page.on('response', async (r) => {
      const url = new URL(r.url())
      if (url.pathname !== '/api/v1/strings/map' || !r.ok()) return
      const body = (await r.json()) as { clusters: unknown[]; items: unknown[] }
      answers.push({
        zoom: Number(url.searchParams.get('zoom')),
        clusters: body.clusters.length,
        items: body.items.length,
      })
    })
    await page.goto(`${app.baseUrl}/map`)
    await page.locator('.leaflet-marker-icon').first().waitFor()
    await expect.poll(() => answers.length).toBeGreaterThan(0)
    // Zoom out to the district: the server groups the town.
    for (let i = 0; i < 4; i++) await page.getByRole('button', { name: 'Zoom out' }).click()
    await expect.poll(() => answers.some((a) => a.zoom < 15 && a.clusters > 0)).toBe(true)
    await expect.poll(() => page.locator('.leaflet-marker-icon').count()).toBeGreaterThan(0)
    await context.close()
  })
})
