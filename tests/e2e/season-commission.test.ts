// A crew member commissions a string with no signal (issue 15): the record and its as-installed photo
// wait on the phone (the form's head says so), then arrive exactly once when the signal returns, and
// the string is installed.
// Readings inside their limits: 150 MΩ on a 230 V circuit (BS 7671 Table 64 minimum 1.0 MΩ); 24 ms at
// 1 × and 14 ms at 5 × IΔn (BS EN 61008-1: 300 ms; BS 7671 reg 415.1.1: 40 ms); 4.2 m over a footway
// (trade-reference §7: at least 3.5 m).
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

const D = 86_400_000
const day = (n: number) => new Date(Date.now() + n * D).toISOString().slice(0, 10)

describe('commissioning on the phone', () => {
  let app: E2eApp
  let phone: Phone
  let stringId: number

  beforeAll(async () => {
    app = await startApp()
    phone = await launchPhone()
    // A string back in store, on a column or anchor with a current structural approval.
    const s = await app
      .db('strings')
      .whereNotNull('structureId')
      .whereNull('archivedAt')
      .orderBy('id')
      .first('id', 'structureId')
    stringId = s.id
    const st = await app.db('structures').where({ id: s.structureId }).first('kind')
    await app.db('certificates').insert({
      kind: st.kind === 'column' ? 'column_structural' : 'anchor_test',
      subjectType: 'structure',
      subjectId: s.structureId,
      doneOn: day(-10),
      nextDue: day(1000),
      result: 'pass',
    })
    await app.db('strings').where({ id: stringId }).update({ seasonState: 'in_store' })
  })
  afterAll(async () => {
    await phone?.close()
    await app?.close()
  })

  const count = async () =>
    Number((await app.db('commissionings').where({ stringId }).count({ n: '*' }).first())?.n ?? 0)

  it('records a commissioning offline and sends it once with its photo when the signal returns', async () => {
    const { page, context } = phone
    await signIn(page, app.baseUrl, 'crew@example.org')
    await page.goto(`${app.baseUrl}/strings/${stringId}`)
    await page.getByTestId('season-commission').click()
    await page.getByTestId('season-save').waitFor({ timeout: 20_000 })
    const before = await count()

    await context.setOffline(true)
    try {
      await page.getByRole('button', { name: 'Over a footway' }).click()
      await page.getByTestId('height').fill('4.2')
      await page.getByTestId('reading-megohms').fill('150')
      await page.getByTestId('reading-trip-1x').fill('24')
      await page.getByTestId('reading-trip-5x').fill('14')
      await page
        .getByTestId('photo-input')
        .setInputFiles({ name: 'installed.jpg', mimeType: 'image/jpeg', buffer: await smallJpeg() })
      expect(await page.getByTestId('season-preview').innerText()).toContain('Pass')
      await shot(page, 'season-01-commission-offline')
      await page.getByTestId('season-save').click()
      await page.getByTestId('season-saved').waitFor({ timeout: 20_000 })
      expect(await page.getByTestId('season-saved').innerText()).toContain('No signal')
      // The head says a record is waiting, since the season state it shows is still the old one.
      expect(await page.getByTestId('season-waiting').innerText()).toContain(
        'A commissioning saved on this phone',
      )
      await shot(page, 'season-02-commission-waiting')
      await new Promise((r) => setTimeout(r, 1500))
      expect(await count()).toBe(before)
    } finally {
      await context.setOffline(false)
    }
    expect(await eventually(async () => (await count()) === before + 1)).toBe(true)
    const rec = await app
      .db('commissionings')
      .where({ stringId })
      .orderBy('id', 'desc')
      .first('visitId', 'result', 'place')
    expect(rec).toMatchObject({ result: 'pass', place: 'footway' })
    expect(
      await eventually(
        async () =>
          Number((await app.db('photos').where({ visitId: rec.visitId }).count({ n: '*' }).first())?.n) === 1,
      ),
    ).toBe(true)
    await expect.poll(() => page.getByTestId('outbox-badge').count(), { timeout: 15_000 }).toBe(0)
    expect(await page.getByTestId('season-waiting').count()).toBe(0)
    await new Promise((r) => setTimeout(r, 1500))
    expect(await count()).toBe(before + 1)
    expect((await app.db('strings').where({ id: stringId }).first('seasonState')).seasonState).toBe(
      'installed',
    )
  })
})
