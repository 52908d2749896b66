// Accessibility check (issue 14 part 5): axe-core (the open-source WCAG rule engine, through
// @axe-core/playwright) over every page in each role's navigation, a string's page, and the public
// pages, in the day and the night theme, at phone size. Fails on any "serious" or "critical" finding
// against WCAG 2.1 A and AA (W3C Recommendation, 2018; rules as axe-core 4.x maps them), which
// includes text contrast ≥ 4.5:1 (WCAG 2.1 SC 1.4.3), a label on every field (SC 1.3.1, 4.1.2) and
// names for every button and link (SC 4.1.2). One h1 per page is common practice (no WCAG criterion
// demands it; axe's "page-has-heading-one" asks for at least one): checked here as well.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { AxeBuilder } from '@axe-core/playwright'
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { launchBrowser, startApp, type RunningApp } from './supervisor-helpers'
import { NAV } from '../../src/router/nav'
import type { Role } from '../../shared/roles'

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

const THEMES = ['light', 'dark'] as const
type Theme = (typeof THEMES)[number]

interface Finding {
  page: string
  theme: Theme
  rule: string
  impact: string
  targets: string[]
}

async function openContext(theme: Theme, role: Role | null): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } })
  // The theme the app remembers (src/composables/use-theme.ts keeps the choice under lw.theme).
  // (Quasar's LocalStorage writes a string as `__q_strn|value`.)
  await context.addInitScript(`localStorage.setItem('lw.theme', '__q_strn|${theme}')`)
  if (role) {
    const res = await context.request.post(`${app.baseUrl}/api/v1/auth/sign-in`, {
      data: { email: `${role}@example.org`, password: 'lampwright' },
    })
    expect(res.status()).toBe(200)
  }
  return context
}

/** Waits for the page to settle: its heading drawn and no request in flight. */
async function settle(page: Page): Promise<void> {
  await page.locator('h1').first().waitFor({ timeout: 15_000 })
  await page.waitForLoadState('networkidle', { timeout: 3000 }).catch(() => undefined)
  // Quasar's transitions fade content in; judge colours once they are done.
  await page.waitForTimeout(400)
}

async function check(page: Page, path: string, theme: Theme): Promise<Finding[]> {
  await page.goto(`${app.baseUrl}${path}`)
  await settle(page)
  const result = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'])
    .analyze()
  const findings: Finding[] = result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({
      page: path,
      theme,
      rule: v.id,
      impact: v.impact ?? '',
      targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')),
    }))
  const headings = await page.locator('h1').count()
  if (headings !== 1)
    findings.push({ page: path, theme, rule: 'one-h1', impact: 'serious', targets: [`${headings} h1`] })
  return findings
}

async function checkAll(role: Role | null, paths: string[]): Promise<Finding[]> {
  const findings: Finding[] = []
  for (const theme of THEMES) {
    const context = await openContext(theme, role)
    const page = await context.newPage()
    for (const path of paths) findings.push(...(await check(page, path, theme)))
    await context.close()
  }
  return findings
}

describe('every page passes the WCAG 2.1 AA checks of axe-core, in both themes', () => {
  it('public pages', async () => {
    const ref = (await app.db('reports').first('ref'))?.ref
    const paths = [
      '/sign-in',
      '/report',
      '/forgot-password',
      ...(ref ? [`/report?ref=${encodeURIComponent(ref)}`] : []),
    ]
    expect(await checkAll(null, paths)).toEqual([])
  })

  it.each(Object.keys(NAV) as Role[])('%s pages', async (role) => {
    const paths = NAV[role].map((n) => n.to)
    if (role === 'crew' || role === 'supervisor') {
      const string = await app.db('strings').whereNull('archivedAt').first('id')
      paths.push(`/strings/${string.id}`)
    }
    expect(await checkAll(role, paths)).toEqual([])
  })
})
