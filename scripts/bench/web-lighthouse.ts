// For scripts/bench/web.ts: one Lighthouse 12.2.3 run of one page with its default (mobile) settings
// in Debian's Chromium, reduced to the figures the web budget checks (issue 14).
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import lighthouse from 'lighthouse'
import * as chromeLauncher from 'chrome-launcher'

export const CHROME_PATH = process.env.CHROME_PATH ?? '/usr/bin/chromium'

export interface PageFigures {
  name: string
  performance: number
  accessibility: number
  bestPractices: number
  /** Milliseconds, from Lighthouse's simulated mobile throttling. */
  lcp: number
  tbt: number
  cls: number
  /** JavaScript transferred, kB (1,000 bytes), headers included, as Lighthouse's resource summary counts it. */
  jsKb: number
  /** Failed accessibility and best-practices audits (id), and the biggest performance hints. */
  notes: string[]
}

export interface Browser {
  port: number
  close(): Promise<void>
}

export async function openBrowser(): Promise<Browser> {
  const chrome = await chromeLauncher.launch({
    chromePath: CHROME_PATH,
    chromeFlags: [
      '--headless=new',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
    logLevel: 'silent',
  })
  return { port: chrome.port, close: async () => chrome.kill() }
}

type Lhr = NonNullable<Awaited<ReturnType<typeof lighthouse>>>['lhr']

function failedAudits(lhr: Lhr, category: string): string[] {
  return lhr.categories[category].auditRefs
    .filter((r) => r.weight > 0 && (lhr.audits[r.id].score ?? 1) < 1)
    .map((r) => `${category}: ${r.id}`)
}

function perfHints(lhr: Lhr): string[] {
  return Object.values(lhr.audits)
    .filter((a) => a.details?.type === 'opportunity' && (a.numericValue ?? 0) >= 150)
    .map((a) => `performance: ${a.id} ~${Math.round(a.numericValue ?? 0)} ms`)
}

function scriptKb(lhr: Lhr): number {
  const summary = lhr.audits['resource-summary'].details as {
    items?: { resourceType: string; transferSize: number }[]
  }
  const script = summary.items?.find((i) => i.resourceType === 'script')
  return (script?.transferSize ?? 0) / 1000
}

/** Trace-recording failures (NO_NAVSTART, NO_FCP…) are Lighthouse's own flakes on a busy machine:
 * a page gets up to three tries before its error counts. */
const TRIES = 3

async function lighthouseRun(browser: Browser, url: string, cookie: string | null): Promise<Lhr> {
  for (let attempt = 1; ; attempt++) {
    const result = await lighthouse(url, {
      port: browser.port,
      output: 'json',
      logLevel: 'error',
      onlyCategories: ['performance', 'accessibility', 'best-practices'],
      ...(cookie ? { extraHeaders: { Cookie: cookie } } : {}),
    })
    if (!result) throw new Error(`Lighthouse returned nothing for ${url}`)
    const { lhr } = result
    if (!lhr.runtimeError) return lhr
    if (attempt >= TRIES) throw new Error(`Lighthouse on ${url}: ${lhr.runtimeError.message}`)
    console.warn(`Lighthouse on ${url}: ${lhr.runtimeError.code}, trying again`)
  }
}

/** Runs Lighthouse once on `url`, the session cookie (if any) sent with every request of the page. */
export async function audit(
  browser: Browser,
  name: string,
  url: string,
  cookie: string | null,
  reportDir: string,
): Promise<PageFigures> {
  const lhr = await lighthouseRun(browser, url, cookie)
  mkdirSync(reportDir, { recursive: true })
  writeFileSync(join(reportDir, `${name.replace(/\W+/g, '-')}.json`), JSON.stringify(lhr))
  const n = (id: string) => lhr.audits[id].numericValue ?? NaN
  return {
    name,
    performance: lhr.categories.performance.score ?? 0,
    accessibility: lhr.categories.accessibility.score ?? 0,
    bestPractices: lhr.categories['best-practices'].score ?? 0,
    lcp: n('largest-contentful-paint'),
    tbt: n('total-blocking-time'),
    cls: n('cumulative-layout-shift'),
    jsKb: scriptKb(lhr),
    notes: [...failedAudits(lhr, 'accessibility'), ...failedAudits(lhr, 'best-practices'), ...perfHints(lhr)],
  }
}
