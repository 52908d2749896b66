// Issue 12 part 2 in a real browser at phone size: a passer-by reports a hazard with a photo, the
// supervisor puts it on Lantern's run, the crew member sees it marked Emergency with the reporter's
// words and photo and the hazard caution, logs what they found and did from the stop (through the
// outbox), and the report reads Fixed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import {
  apiCall,
  apiToken,
  eventually,
  launchPhone,
  shot,
  signIn,
  smallJpeg,
  startApp,
  type E2eApp,
  type Phone,
} from './helpers'

// The server's "today" (the crew's /run page, GET /runs/mine) is the UTC date.
const today = new Date().toISOString().slice(0, 10)
// The minimum fill time of the report form (server/services/report-guards.ts MIN_FILL_MS).
const MIN_FILL_MS = 3_000
const WORDS = 'A cable is hanging down to head height and sparking.'

describe('a hazard report reaches the crew and is logged from the stop', () => {
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

  const token = (email: string) => apiToken(app.baseUrl, email)
  const api = <T>(token: string, method: string, path: string, body?: unknown) =>
    apiCall<T>(app.baseUrl, token, method, path, body)

  it('shows Emergency, the words, the photo and the caution, and the log closes it', async () => {
    const { page } = phone
    const target = await app
      .db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .whereNull('s.archivedAt')
      .where({ 's.geometry': 'point' })
      .whereNull('si.accessFrom')
      .whereNotIn(
        's.id',
        app
          .db('reports')
          .whereIn('state', ['received', 'in_hand', 'scheduled'])
          .whereNotNull('stringId')
          .select('stringId'),
      )
      .orderBy('s.id')
      .first('s.id', 's.assetTag')

    // 1. The passer-by reports the hazard with a photo.
    await page.goto(`${app.baseUrl}/report`)
    const tagField = page.getByLabel('The number on the lights (if you can see it)')
    await tagField.waitFor({ timeout: 20_000 })
    const opened = Date.now()
    await tagField.fill(target.assetTag)
    await page.getByLabel('What is wrong?').fill(WORDS)
    await page.getByLabel('Near (shop, house number, landmark)').fill('Outside the bakery')
    await page.getByText('Is anything dangerous?').click()
    await page.locator('input[type="file"]').setInputFiles({
      name: 'hazard.jpg',
      mimeType: 'image/jpeg',
      buffer: await smallJpeg(),
    })
    const wait = MIN_FILL_MS + 1_000 - (Date.now() - opened)
    if (wait > 0) await page.waitForTimeout(wait)
    await page.getByRole('button', { name: 'Send report' }).click()
    const ref = (await page.getByTestId('report-ref').innerText({ timeout: 20_000 })).trim()
    const report = await app.db('reports').where({ ref }).first('id', 'queueItemId')
    expect(
      await eventually(
        async () => !!(await app.db('reportPhotos').where({ reportId: report.id }).first('id')),
      ),
    ).toBe(true)

    // 2. The supervisor puts it on Lantern's run for tonight.
    const sup = await token('supervisor@example.org')
    const crews = await api<{ items: { id: number; name: string }[] }>(sup, 'GET', '/crews')
    const lantern = crews.items.find((c) => c.name === 'Lantern')!
    const runs = await api<{ runs: { crewId: number; stops: { itemId: number }[] }[] }>(
      sup,
      'GET',
      `/runs?date=${today}`,
    )
    const before = runs.runs.find((r) => r.crewId === lantern.id)?.stops.map((s) => s.itemId) ?? []
    await api(sup, 'POST', '/runs/publish', {
      date: today,
      runs: [{ crewId: lantern.id, itemIds: [...before, report.queueItemId] }],
    })

    // 3. The crew member sees the stop marked Emergency, with the words, photo and caution.
    await signIn(page, app.baseUrl, 'crew@example.org')
    await page.waitForURL(/\/run$/)
    const stop = page.locator(`[data-string-id="${target.id}"][data-kind="public_report"]`).first()
    await stop.waitFor({ timeout: 20_000 })
    await stop.scrollIntoViewIfNeeded()
    await expect.poll(() => stop.getByTestId('emergency-mark').textContent()).toContain('Emergency')
    expect(await stop.innerText()).toContain(WORDS)
    expect(await stop.innerText()).toContain('Outside the bakery')
    expect(await stop.locator('img[alt^="Photo sent with report"]').count()).toBe(1)
    expect(await stop.getByTestId('hazard-caution').innerText()).toContain('Hazard reported:')
    await shot(page, 'report-emergency-01-stop')

    // 4. The crew logs it from the stop; the outbox sends it and the report reads Fixed.
    await stop.getByRole('button', { name: 'Log emergency' }).click()
    const dialog = page.getByTestId('emergency-log')
    await dialog.waitFor()
    await dialog.getByLabel('What I found').fill('Festoon feed cable pulled from its clip, sheath split.')
    await dialog.getByLabel('What I did').fill('Isolated at the column, replaced the cable and clipped it.')
    await dialog.getByText('Made safe and fixed: nothing left to do').click()
    await shot(page, 'report-emergency-02-log')
    await dialog.getByRole('button', { name: 'Save log' }).click()
    expect(
      await eventually(async () => (await app.db('reports').where({ ref }).first('state')).state === 'fixed'),
    ).toBe(true)
    const log = await app.db('emergencyLogs').where({ queueItemId: report.queueItemId }).select('outcome')
    expect(log).toEqual([{ outcome: 'fixed' }])
    // 5. The string's page keeps the log in its history.
    await page.goto(`${app.baseUrl}/strings/${target.id}`)
    const logs = page.getByRole('region', { name: 'Emergency logs' })
    await logs.waitFor({ timeout: 20_000 })
    expect(await logs.innerText()).toContain('Festoon feed cable pulled from its clip')
    await logs.scrollIntoViewIfNeeded()
    await shot(page, 'report-emergency-03-string')

    await page.goto(`${app.baseUrl}/report?ref=${ref}`)
    const history = page.getByTestId('report-history')
    await history.waitFor({ timeout: 20_000 })
    await expect.poll(() => history.locator('.report-history__step--now').innerText()).toContain('Fixed')
  })
})
