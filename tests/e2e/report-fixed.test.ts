// Issue 12's loop, in a real browser: a passer-by reports lights out on /report, a supervisor puts the
// report on Lantern's run for tonight and publishes (through the API, as the planner page would), the
// crew member sees it under the bell and fixes the string from the run, and the reporter's status page
// — opened from the link in the acknowledgement e-mail — reads "Fixed".
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import {
  apiCall,
  apiToken,
  eventually,
  launchPhone,
  shot,
  signIn,
  startApp,
  type E2eApp,
  type Phone,
} from './helpers'

// The server's "today" (the crew's /run page, GET /runs/mine) is the UTC date.
const today = new Date().toISOString().slice(0, 10)
const REPORTER = 'passer.by@example.org'
// The minimum fill time of the report form (issue 12: a send under 3 s after opening is a robot's).
const MIN_FILL_MS = 3_000

describe('a public report comes back fixed', () => {
  let app: E2eApp
  let phone: Phone

  beforeAll(async () => {
    app = await startApp()
    phone = await launchPhone()
  })
  afterAll(async () => {
    await phone?.close()
    await app?.close()
  })

  const api = <T>(token: string, method: string, path: string, body?: unknown) =>
    apiCall<T>(app.baseUrl, token, method, path, body)

  it('is filed, scheduled, fixed from the run, and its status page reads Fixed', async () => {
    const { page } = phone
    // A string a crew can fix tonight: lamps out but not dark (so replacing them makes it lit), no
    // report waiting on it, a point fitting (no platform needed) on a site open at any hour.
    const target = await app
      .db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .whereNull('s.archivedAt')
      .where({ 's.dark': false, 's.fuseFailed': false, 's.isolated': false, 's.geometry': 'point' })
      .where('s.lampsOut', '>', 0)
      .whereNull('si.accessFrom')
      .whereNotIn(
        's.id',
        app
          .db('reports')
          .whereIn('state', ['received', 'in_hand', 'scheduled'])
          .whereNotNull('stringId')
          .select('stringId'),
      )
      .orderBy('s.id', 'desc')
      .first('s.id', 's.assetTag', 's.lampsOut')
    expect(target).toBeDefined()

    // 1. The passer-by files the report.
    await page.goto(`${app.baseUrl}/report`)
    // The form starts its clock when it appears (the page is loaded on first visit), so start ours then.
    const tagField = page.getByLabel('The number on the lights (if you can see it)')
    await tagField.waitFor({ timeout: 20_000 })
    const opened = Date.now()
    await tagField.fill(target.assetTag)
    await page.getByLabel('What is wrong?').fill('Several lamps are out on this string, near the bus stop.')
    await page.getByLabel('Your e-mail').fill(REPORTER)
    // Past the minimum fill time, or the server quietly drops the report as a robot's.
    const wait = MIN_FILL_MS + 1_000 - (Date.now() - opened)
    if (wait > 0) await page.waitForTimeout(wait)
    await page.getByRole('button', { name: 'Send report' }).click()
    const ref = (await page.getByTestId('report-ref').innerText({ timeout: 20_000 })).trim()
    expect(ref).toMatch(/^LW-[0-9A-Z]{5}$/)
    await shot(page, 'report-fixed-01-receipt')
    const report = await app.db('reports').where({ ref }).first('id', 'stringId', 'queueItemId')
    expect(report.stringId).toBe(target.id)
    expect(report.queueItemId).not.toBeNull()

    // The acknowledgement e-mail carries the status link (queued in the outbox with the report).
    const ack = await app.db('emailOutbox').where({ toAddress: REPORTER }).orderBy('id').first('text')
    const link = /https?:\/\/\S*\/report\?ref=[^\s&]+/.exec(ack?.text ?? '')?.[0]
    expect(link, 'status link in the acknowledgement').toBeDefined()
    const statusPath = new URL(link!).pathname + new URL(link!).search

    // 2. The supervisor puts it on Lantern's run for tonight, after the stops already there.
    const sup = await signInApi('supervisor@example.org')
    const crews = await api<{ items: { id: number; name: string }[] }>(sup, 'GET', '/crews')
    const lantern = crews.items.find((c) => c.name === 'Lantern')!
    const runs = await api<{ runs: { crewId: number; stops: { itemId: number }[] }[] }>(
      sup,
      'GET',
      `/runs?date=${today}`,
    )
    const before = runs.runs.find((r) => r.crewId === lantern.id)?.stops.map((s) => s.itemId) ?? []
    const published = await api<{ runs: { crewId: number; stops: { itemId: number }[] }[] }>(
      sup,
      'POST',
      '/runs/publish',
      {
        date: today,
        runs: [{ crewId: lantern.id, itemIds: [...before, report.queueItemId] }],
      },
    )
    const run = published.runs.find((r) => r.crewId === lantern.id)!
    expect(run.stops.map((s) => s.itemId)).toContain(report.queueItemId)
    expect((await app.db('reports').where({ ref }).first('state')).state).toBe('scheduled')

    // 3. The crew member sees the report under the bell, then fixes the string from the run.
    const crewUser = await app.db('users').where({ email: 'crew@example.org' }).first('id')
    await signIn(page, app.baseUrl, 'crew@example.org')
    await page.waitForURL(/\/run$/)
    const bell = page.getByTestId('notice-bell')
    await expect
      .poll(() => bell.getAttribute('aria-label'), { timeout: 20_000 })
      .toMatch(/^Notices, \d+ unread$/)
    await bell.click()
    const notice = page.locator('.notice-list').getByText(ref, { exact: false })
    await notice.first().waitFor({ timeout: 20_000 })
    await shot(page, 'report-fixed-02-bell')
    // Opened: every notice it showed is marked read on the server.
    expect(
      await eventually(
        async () => (await app.db('notices').where({ userId: crewUser.id }).whereNull('readAt')).length === 0,
      ),
    ).toBe(true)
    await page.keyboard.press('Escape')

    const stop = page.locator(`[data-string-id="${target.id}"]`).first()
    await stop.waitFor({ timeout: 20_000 })
    await stop.getByRole('link', { name: 'Log visit' }).click()
    await page.getByTestId('state-preview').waitFor({ timeout: 20_000 })
    const plus = page.getByTestId('replaced-plus')
    for (let i = 0; i < target.lampsOut; i++) await plus.click()
    expect(await page.getByTestId('replaced').inputValue()).toBe(String(target.lampsOut))
    await page.getByTestId('lock-id').fill('LK-21')
    await page.getByTestId('tester-id').fill('VT-5')
    for (const step of ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester'])
      await page.getByTestId(`step-${step}`).click()
    await page.getByTestId('save-visit').click()
    await page.getByTestId('outcome-recorded').waitFor({ timeout: 30_000 })
    await shot(page, 'report-fixed-03-visit')
    expect((await app.db('strings').where({ id: target.id }).first('status')).status).toBe('lit')

    // 4. The reporter's status page, from the e-mailed link, reads "Fixed".
    await page.goto(`${app.baseUrl}${statusPath}`)
    const history = page.getByTestId('report-history')
    await history.waitFor({ timeout: 20_000 })
    await expect.poll(() => history.locator('.report-history__step--now').innerText()).toContain('Fixed')
    await shot(page, 'report-fixed-04-status')
    expect((await app.db('reports').where({ ref }).first('state')).state).toBe('fixed')
  })

  const signInApi = (email: string) => apiToken(app.baseUrl, email)
})
