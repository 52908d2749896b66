// Issue 14 (crew screens), on a 390 px phone: a crew member fixes a stop from tonight's run and the
// run shows it: the stop reads "Done" (no longer its ticket's "replace now" with "Log visit" as its
// main action) and the header's done / left counts move by one.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { apiCall, apiToken, launchPhone, shot, signIn, startApp, type E2eApp, type Phone } from './helpers'

// The server's "today" (GET /runs/mine without a date) is the UTC date, as in report-fixed.test.ts.
const today = new Date().toISOString().slice(0, 10)

describe('a fixed stop reads done on the run', () => {
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

  const token = (email: string) => apiToken(app.baseUrl, email)

  it('logs a relamp from the run, then the stop reads done and one more is counted done', async () => {
    const { page } = phone
    // Strings a relamp makes lit (lamps out, not dark, fuse lamp whole, not made safe) with an open
    // "replace now" item: put one on Lantern's run for tonight unless one is there already.
    const fixable = await app
      .db('queueItems as q')
      .join('strings as s', 's.id', 'q.stringId')
      .where({ 'q.kind': 'replace_now', 'q.state': 'open' })
      .where({ 's.dark': false, 's.fuseFailed': false, 's.isolated': false })
      .where('s.lampsOut', '>', 0)
      .select('q.id as itemId', 's.id as stringId', 's.lampsOut')
    expect(fixable.length).toBeGreaterThan(0)
    const sup = await token('supervisor@example.org')
    const crews = await api<{ items: { id: number; name: string }[] }>(sup, 'GET', '/crews')
    const lantern = crews.items.find((c) => c.name === 'Lantern')!
    type Run = { crewId: number; stops: { itemId: number; progress?: { state: string } }[] }
    const runs = await api<{ runs: Run[] }>(sup, 'GET', `/runs?date=${today}`)
    const stops = runs.runs.find((r) => r.crewId === lantern.id)?.stops ?? []
    const todo = (itemId: number) => stops.some((s) => s.itemId === itemId && s.progress?.state === 'todo')
    let target = fixable.find((f) => todo(f.itemId))
    if (!target) {
      // Added after the stops already there; one whose structure is not approved may be refused.
      const before = stops.map((s) => s.itemId)
      const published = await api<{ runs: Run[] }>(sup, 'POST', '/runs/publish', {
        date: today,
        runs: [{ crewId: lantern.id, itemIds: [...before, ...fixable.map((f) => f.itemId)] }],
      })
      const taken = new Set(published.runs.flatMap((r) => r.stops.map((s) => s.itemId)))
      target = fixable.find((f) => taken.has(f.itemId))
    }
    expect(target, 'a fixable stop on the run').toBeDefined()
    const { stringId, lampsOut } = target!

    await signIn(page, app.baseUrl, 'crew@example.org')
    await page.waitForURL(/\/run$/)
    await expect.poll(() => page.locator('h1').innerText()).toBe("Tonight's run")
    const stop = page.locator(`[data-string-id="${stringId}"]`).first()
    await stop.waitFor({ timeout: 20_000 })
    expect(await stop.getAttribute('data-state')).toBe('todo')
    const count = async (id: string) => Number(await page.getByTestId(id).locator('b').innerText())
    const done = await count('run-done')
    const left = await count('run-left')
    await stop.scrollIntoViewIfNeeded()
    await shot(page, 'run-progress-01-before')

    // Relamp: every lamp out replaced, under a recorded isolation.
    await stop.getByRole('link', { name: 'Log visit' }).click()
    await page.getByTestId('state-preview').waitFor({ timeout: 20_000 })
    const plus = page.getByTestId('replaced-plus')
    for (let i = 0; i < lampsOut; i++) await plus.click()
    await page.getByTestId('lock-id').fill('LK-31')
    await page.getByTestId('tester-id').fill('VT-8')
    for (const step of ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester'])
      await page.getByTestId(`step-${step}`).click()
    await page.getByTestId('save-visit').click()
    await page.getByTestId('outcome-recorded').waitFor({ timeout: 30_000 })

    // Back on the run: the stop reads done, its main action is no longer "Log visit".
    await page.getByRole('link', { name: "Tonight's run" }).first().click()
    await page.waitForURL(/\/run$/)
    const after = page.locator(`[data-string-id="${stringId}"]`).first()
    await expect.poll(() => after.getAttribute('data-state'), { timeout: 20_000 }).toBe('done')
    expect(await after.locator('[data-state="done"]').innerText()).toContain('Done')
    expect(await after.getByRole('link', { name: 'Log visit', exact: true }).count()).toBe(0)
    expect(await after.getByRole('link', { name: 'Log another visit' }).count()).toBe(1)
    expect(await count('run-done')).toBe(done + 1)
    expect(await count('run-left')).toBe(left - 1)
    // Nothing runs off the side of the phone.
    expect(await page.locator('html').evaluate((el) => el.scrollWidth)).toBeLessThanOrEqual(390)
    await after.scrollIntoViewIfNeeded()
    await shot(page, 'run-progress-02-after')
  })
})
