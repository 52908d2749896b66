// A crew member's night in the field, in a real browser against the real server and database:
// tonight's run → log a relamp with its isolation and a photo → the string's new state; then the
// same again with no signal, queued on the phone and sent once when the signal returns.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import {
  eventually,
  launchPhone,
  shot,
  signIn,
  smallJpeg,
  startApp,
  type E2eApp,
  type Phone,
} from './helpers'

const countVisits = async (app: E2eApp, stringId: number) =>
  Number((await app.db('visits').where({ stringId }).count({ n: '*' }).first())?.n ?? 0)

// State words: /work/shared/product-brief.md, "Words".
const WORD = { lit: 'Lit', watch: 'Watch', replace: 'Replace now', dark: 'Dark', safe: 'Made safe' }

describe('crew in the field', () => {
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

  it('logs a relamp from the run, then a visit made offline arrives exactly once', async () => {
    const { page, context } = phone
    await signIn(page, app.baseUrl, 'crew@example.org')
    // The crew's home is tonight's run.
    await page.waitForURL(/\/run$/)

    // Pick a stop whose string has lamps out to replace; if tonight's run has none (another test or a
    // demo session may have relamped them), open such a string's visit form directly.
    await page.locator('[data-testid^="run-stop-"], .empty-state').first().waitFor({ timeout: 20_000 })
    await shot(page, 'e2e-01-run')
    const onRun = (
      await page
        .locator('[data-string-id]')
        .evaluateAll((els) => els.map((e) => e.getAttribute('data-string-id')))
    )
      .filter((id): id is string => !!id)
      .map(Number)
    const relampable = () =>
      app.db('strings').where({ dark: false, fuseFailed: false, isolated: false }).where('lampsOut', '>', 0)
    const fromRun = onRun.length ? await relampable().whereIn('id', onRun).first('id') : undefined
    const stringId: number = fromRun?.id ?? (await relampable().first('id')).id
    if (fromRun) {
      const stop = page.locator(`[data-string-id="${stringId}"]`).first()
      await stop.getByRole('link', { name: /^Log (another )?visit$/ }).click()
    } else {
      await page.goto(`${app.baseUrl}/strings/${stringId}/visit`)
    }
    const before = await app.db('strings').where({ id: stringId }).first('lampsOut', 'status')

    // The engine's preview reads the string's current state before anything is typed.
    await page.getByTestId('state-preview').waitFor()
    await expect
      .poll(() => page.getByTestId('preview-state').innerText())
      .toContain(WORD[before.status as keyof typeof WORD])

    // Replace every lamp recorded out.
    const plus = page.getByTestId('replaced-plus')
    for (let i = 0; i < before.lampsOut; i++) await plus.click()
    expect(await page.getByTestId('replaced').inputValue()).toBe(String(before.lampsOut))
    // The caution appears where relamping starts.
    await expect
      .poll(() => page.getByTestId('isolation').innerText())
      .toContain('Lamp sockets on a series string can carry the full supply voltage')
    await page.getByTestId('lock-id').fill('LK-17')
    await page.getByTestId('tester-id').fill('VT-3')
    for (const step of ['identify', 'isolate', 'lock_off', 'prove_tester', 'test_dead', 'reprove_tester']) {
      await page.getByTestId(`step-${step}`).click()
    }
    await page.getByTestId('photo-input').setInputFiles({
      name: 'string.jpg',
      mimeType: 'image/jpeg',
      buffer: await smallJpeg(),
    })
    await shot(page, 'e2e-02-visit-form')
    const visitsBefore = await countVisits(app, stringId)
    await page.getByTestId('save-visit').click()

    await page.getByTestId('outcome-recorded').waitFor({ timeout: 30_000 })
    await page.getByTestId('outcome-photo-sent').waitFor({ timeout: 30_000 })
    await shot(page, 'e2e-03-recorded')
    // Every lamp out replaced on a string that was not dark: the server now records it lit.
    const after = await app.db('strings').where({ id: stringId }).first('lampsOut', 'status')
    expect(after).toMatchObject({ lampsOut: 0, status: 'lit' })
    expect(await page.getByTestId('outcome-state').innerText()).toContain(WORD.lit)
    const visit = await app.db('visits').where({ stringId }).orderBy('id', 'desc').first('id', 'isolationId')
    expect(await countVisits(app, stringId)).toBe(visitsBefore + 1)
    expect(visit.isolationId).not.toBeNull()
    const photos = await app.db('photos').where({ visitId: visit.id }).count({ n: '*' }).first()
    expect(Number(photos?.n)).toBe(1)

    // No signal: the next visit waits on the phone.
    const offlineBefore = await countVisits(app, stringId)
    await context.setOffline(true)
    try {
      await page.getByRole('button', { name: 'Log another visit' }).click()
      await page.getByTestId('failed-found-plus').click()
      await page.getByTestId('notes').fill('Found one more out after switch-on; logged without signal.')
      await page.getByTestId('save-visit').click()
      await page.getByTestId('outcome-queued').waitFor({ timeout: 30_000 })
      await expect.poll(() => page.getByTestId('outbox-count').innerText()).toMatch(/^1\s/)
      await shot(page, 'e2e-04-queued-offline')
      await new Promise((r) => setTimeout(r, 1500))
      expect(await countVisits(app, stringId)).toBe(offlineBefore)
    } finally {
      // Signal back: the outbox drains by itself.
      await context.setOffline(false)
    }
    expect(await eventually(async () => (await countVisits(app, stringId)) === offlineBefore + 1)).toBe(true)
    await page.getByTestId('outcome-recorded').waitFor({ timeout: 30_000 })
    await expect.poll(() => page.getByTestId('outbox-badge').count(), { timeout: 15_000 }).toBe(0)
    await shot(page, 'e2e-05-sent')
    // Exactly one: a resend or a stray retry must not add a second record.
    await new Promise((r) => setTimeout(r, 1500))
    expect(await countVisits(app, stringId)).toBe(offlineBefore + 1)
    const last = await app
      .db('visits')
      .where({ stringId })
      .orderBy('id', 'desc')
      .first('failedFound', 'notes')
    expect(last).toMatchObject({
      failedFound: 1,
      notes: 'Found one more out after switch-on; logged without signal.',
    })
  })

  it("reopens tonight's run and a visit form after a reload with no signal", async () => {
    const { page, context } = phone
    await page.goto(`${app.baseUrl}/run`)
    await page.locator('[data-testid^="run-stop-"], .empty-state').first().waitFor({ timeout: 20_000 })
    const withString = page.locator('[data-string-id]:not([data-string-id=""])')
    const strings = await withString.count()
    // Online, the run page saves every string on it to the phone; wait until that is done.
    if (strings) await expect.poll(() => page.getByTestId('run-ready').innerText()).toMatch(/^(\d+) of \1 /)
    // A string, not a function: the test compiles without the DOM types.
    await page.evaluate('navigator.serviceWorker.ready.then(() => true)')

    await context.setOffline(true)
    try {
      await page.reload()
      // The app shell comes from the service worker, the run from the phone's copy.
      await page.getByTestId('run-offline').waitFor({ timeout: 20_000 })
      await shot(page, 'e2e-06-offline-run')
      if (strings) {
        // A stop the first test fixed reads "Log another visit": either opens the form.
        await withString
          .first()
          .getByRole('link', { name: /^Log (another )?visit$/ })
          .click()
        await page.getByTestId('state-preview').waitFor({ timeout: 20_000 })
        await shot(page, 'e2e-07-offline-visit-form')
      }
    } finally {
      await context.setOffline(false)
    }
  })
})
