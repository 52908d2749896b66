// The certificate-reminders job (issue 12 part 3): run from POST /admin/jobs/certificate-reminders/run,
// it e-mails every active safety officer when a certificate comes within 30 days of its next due date
// (and 14 days, and on the day), once each: a second run sends nothing. The mail fake catches it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let admin: string
// A fixed clock: Monday 7 Dec 2026, 07:00 UTC (07:00 in London, GMT in December).
const NOW = new Date('2026-12-07T07:00:00Z')
const tag = `CR${Date.now().toString(36).toUpperCase()}`
const ids: Record<string, number> = {}

beforeAll(async () => {
  t = await makeTestApp()
  t.deps.now = () => NOW
  admin = `Bearer ${await t.token('admin')}`
  ;[ids.platform] = await t.db('platforms').insert({
    assetTag: `${tag}-P`,
    name: 'Reminder fixture platform',
    kind: 'scissor',
    workingHeightM: 10,
    safeWorkingLoadKg: 200,
  })
  // Due 6 Jan 2027: by hand, 7 Dec → 31 Dec is 24 days, + 6 = 30 days after the clock's day.
  ;[ids.cert] = await t.db('certificates').insert({
    kind: 'platform_exam',
    subjectType: 'platform',
    subjectId: ids.platform,
    reference: `TE-${tag}`,
    doneOn: '2026-07-06',
    nextDue: '2027-01-06',
    result: 'pass',
  })
})
afterAll(async () => {
  await t.db('certificates').where({ id: ids.cert }).delete()
  await t.close()
})

const reminderMails = () =>
  t
    .db('caughtMail')
    .where('subject', 'like', 'Certificates:%')
    .orderBy('id')
    .select('toAddress', 'subject', 'text')
const run = () =>
  request(t.app).post('/api/v1/admin/jobs/certificate-reminders/run').set('Authorization', admin)

describe('certificate reminders', () => {
  it('sends the 30-day reminder to every active safety officer, and a second run sends none', async () => {
    const before = (await reminderMails()).length
    const first = await run()
    expect(first.status).toBe(200)
    expect(first.body.job).toBe('certificate-reminders')
    const officers = await t.db('users').where({ role: 'safety', active: true }).pluck('email')
    expect(officers.length).toBeGreaterThan(0)
    const mails = (await reminderMails()).slice(before)
    expect(mails.map((m) => m.toAddress).sort()).toEqual([...officers].sort())
    // 6 Jan 2027 is a Wednesday (2 Dec 2026 is a Wednesday; + 35 days = 5 weeks).
    expect(mails[0].text).toContain(
      `- ${tag}-P Reminder fixture platform: Platform thorough examination due Wed, 6 Jan 2027 (30 days), ref. TE-${tag}`,
    )
    expect(mails[0].text).toMatch(/Due within 30 days:/)
    expect(await t.db('certificateReminders').where({ certificateId: ids.cert }).pluck('stage')).toEqual([
      'days_30',
    ])
    const notices = await t
      .db('notices')
      .where({ kind: 'certificate_expiring' })
      .whereIn('userId', t.db('users').where({ role: 'safety' }).select('id'))
      .where('body', 'like', `%${tag}-P%`)
    expect(notices.length).toBe(officers.length)

    const second = await run()
    expect(second.status).toBe(200)
    expect(second.body.result).toMatchObject({ reminders: 0, recipients: 0 })
    expect((await reminderMails()).length).toBe(before + mails.length)
  })

  it('sends the 14-day reminder once the clock reaches it (23 Dec 2026: 14 days before 6 Jan)', async () => {
    t.deps.now = () => new Date('2026-12-23T07:00:00Z')
    const before = (await reminderMails()).length
    expect((await run()).status).toBe(200)
    const mails = (await reminderMails()).slice(before)
    expect(mails.length).toBeGreaterThan(0)
    expect(mails[0].text).toContain(
      `${tag}-P Reminder fixture platform: Platform thorough examination due Wed, 6 Jan 2027 (14 days)`,
    )
    expect((await run()).body.result.reminders).toBe(0)
    expect(
      (
        await t.db('certificateReminders').where({ certificateId: ids.cert }).orderBy('stage').pluck('stage')
      ).sort(),
    ).toEqual(['days_14', 'days_30'])
  })
})
