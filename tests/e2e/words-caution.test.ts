// Words where the risk is (issue 11 "Done when"): a string page shows volts × amps = watts, a string
// with a failed fuse lamp shows the isolation caution, and the visit form gives the bright-lamp advice.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { launchPhone, shot, signIn, startApp, type E2eApp, type Phone } from './helpers'
import { ISOLATION_CAUTION } from '../../shared/engine/reason-codes'

const COLUMNS = ['lampsOut', 'fuseFailed', 'dark', 'isolated', 'status', 'replaceNow'] as const

describe('string page words', () => {
  let app: E2eApp
  let phone: Phone
  let litId: number
  let fuseId: number
  const saved: Record<string, unknown>[] = []

  beforeAll(async () => {
    app = await startApp()
    phone = await launchPhone()
    // Two demo catenaries (19 shunted lamps + a fuse lamp): one healthy, one with its fuse lamp failed.
    const rows = await app
      .db('strings as s')
      .join('stringTypes as ty', 'ty.id', 's.typeId')
      .where('ty.code', 'CAT-F20')
      .whereNull('s.archivedAt')
      .orderBy('s.id')
      .limit(2)
      .select('s.id', ...COLUMNS.map((c) => `s.${c}`))
    saved.push(...rows)
    ;[litId, fuseId] = rows.map((r) => r.id as number)
    const lit = {
      lampsOut: 0,
      fuseFailed: false,
      dark: false,
      isolated: false,
      status: 'lit',
      replaceNow: false,
    }
    await app.db('strings').where({ id: litId }).update(lit)
    await app
      .db('strings')
      .where({ id: fuseId })
      .update({ ...lit, fuseFailed: true, dark: true, status: 'dark', replaceNow: true })
  })
  afterAll(async () => {
    for (const r of saved) await app?.db('strings').where({ id: r.id }).update(r)
    await phone?.close()
    await app?.close()
  })

  it('shows volts × amps = watts, and the numbers multiply', async () => {
    const { page } = phone
    await signIn(page, app.baseUrl, 'crew@example.org')
    await page.goto(`${app.baseUrl}/strings/${litId}`)
    // The working sits folded under "How this is worked out" (issue 14): open it first.
    await page.getByText('How this is worked out').click()
    const line = page.getByTestId('power-line')
    await line.waitFor({ timeout: 20_000 })
    const text = (await line.textContent()) ?? ''
    expect(text).toContain('×')
    expect(text).toContain('=')
    // As an electrician checks it on the page: volts × amps should give the watts shown, within the
    // rounding of the figures (amps to 0.0001 A → ±0.00005 × 230 V ≈ 0.012 W; watts to 0.1 W).
    const m = text.match(/([\d.,]+)\s+V × ([\d.]+)\s+A(?: × ([\d.]+))? = ([\d.,]+)\s+W/)
    expect(m).not.toBeNull()
    const n = (s: string) => Number(s.replace(/,/g, ''))
    const product = n(m![1]) * n(m![2]) * (m![3] ? n(m![3]) : 1)
    expect(Math.abs(product - n(m![4]))).toBeLessThan(0.2)
    await page.getByTestId('class-table').waitFor()
    // The whole forecast is fetched once the working is open (GET /strings/{id}/forecast).
    await page.getByText('simulated runs of this string').waitFor({ timeout: 20_000 })
    await shot(page, 'words-string-lit')
  })

  it('shows the isolation caution on a string whose fuse lamp has failed', async () => {
    const { page } = phone
    await page.goto(`${app.baseUrl}/strings/${fuseId}`)
    // Beside what to do, never folded away (issue 14: the page leads with the action).
    const caution = page.getByTestId('string-action').getByTestId('isolation-caution')
    await caution.waitFor({ timeout: 20_000 })
    expect(await caution.textContent()).toContain(ISOLATION_CAUTION)
    await shot(page, 'words-string-fuse')
  })

  it('carries the caution on each dark stop of the crew run', async () => {
    const { page } = phone
    await page.goto(`${app.baseUrl}/run`)
    await page.locator('[data-testid^="run-stop-"]').first().waitFor({ timeout: 20_000 })
    // The demo town's run for tonight holds dark strings (seeds/demo): each such stop warns.
    const dark = page.locator('[data-kind="dark"]')
    expect(await dark.count()).toBeGreaterThan(0)
    for (const stop of await dark.all()) {
      if ((await stop.getAttribute('class'))?.includes('stop--done')) continue
      expect(await stop.getByTestId('isolation-caution').textContent()).toContain('full supply voltage')
    }
    await shot(page, 'words-run-dark')
  })

  it('gives the bright-lamp advice with the caution on the visit form', async () => {
    const { page } = phone
    await page.goto(`${app.baseUrl}/strings/${litId}/visit`)
    await page.getByTestId('bright-lamps-plus').click()
    const advice = page.getByTestId('bright-advice')
    await advice.waitFor({ timeout: 20_000 })
    expect(await advice.textContent()).toMatch(/tap the lamp gently so the coils separate/)
    expect(await page.getByTestId('state-preview').getByTestId('isolation-caution').count()).toBe(1)
    await shot(page, 'words-visit-bright')
  })
})
