// The weekly digest and the jobs an admin runs at once: POST /admin/jobs/{name}/run, the mail fake
// catching the digest with a small fixture's figures, and the MariaDB named lock that keeps a job to
// one process at a time.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { withNamedLock } from '../../server/jobs/named-lock'
import { runScheduled } from '../../server/jobs/run-job'

let t: TestApp
let admin: string
const HOUR = 3_600_000
// A fixed clock: Monday 7 Dec 2026, 07:00 UTC (07:00 in London in December, GMT).
const NOW = new Date('2026-12-07T07:00:00Z')
const ago = (h: number) => new Date(NOW.getTime() - h * HOUR)
const FIXTURE = 'Digest Fixture Ltd'
const PLATFORM = { assetTag: 'DG-FIX-1', name: 'Digest fixture platform' }

beforeAll(async () => {
  t = await makeTestApp()
  t.deps.now = () => NOW
  admin = `Bearer ${await t.token('admin')}`
  const [clientId] = await t.db('clients').insert({ name: FIXTURE, kind: 'venue' })
  const [siteId] = await t
    .db('sites')
    .insert({ clientId, name: 'Fixture Yard', kind: 'square', lat: 51.5, lng: -1.5 })
  const item = (o: Record<string, unknown>) => ({
    clientId,
    siteId,
    severity: 'standard',
    summary: 'fixture',
    ...o,
  })
  await t.db('queueItems').insert([
    // A: dark from 50 h to 20 h before now, inside the week: 30 h dark; found and fixed this week.
    item({ kind: 'dark', state: 'closed', openedAt: ago(50), dueBy: ago(26), closedAt: ago(20) }),
    // B: dark from 9 days to 6 days before now: only the day after the week began counts, 24 h;
    // fixed this week, found the week before.
    item({ kind: 'dark', state: 'closed', openedAt: ago(9 * 24), dueBy: ago(8 * 24), closedAt: ago(6 * 24) }),
    // C: replace now, open, due a day ago: past contract time now; found this week.
    item({
      kind: 'replace_now',
      state: 'open',
      openKey: 'replace_now:digest-fixture',
      openedAt: ago(72),
      dueBy: ago(24),
    }),
    // D: snoozed, due in an hour: not late yet; opened 8 days ago, so not found this week either.
    item({
      kind: 'replace_now',
      state: 'snoozed',
      openKey: 'replace_now:digest-fixture-2',
      openedAt: ago(192),
      dueBy: ago(-1),
    }),
  ])
  const [platformId] = await t
    .db('platforms')
    .insert({ ...PLATFORM, kind: 'scissor', workingHeightM: 10, safeWorkingLoadKg: 200 })
  await t.db('certificates').insert({
    kind: 'platform_exam',
    subjectType: 'platform',
    subjectId: platformId,
    doneOn: '2026-06-07',
    nextDue: '2026-12-07',
    result: 'pass',
  })
})
afterAll(() => t.close())

const digestMails = () =>
  t
    .db('caughtMail')
    .where('subject', 'like', 'Lampwright weekly digest%')
    .orderBy('id')
    .select('toAddress', 'subject', 'text')

describe('POST /admin/jobs/{name}/run', () => {
  it('sends the weekly digest to every active manager, with the fixture client’s figures', async () => {
    const before = (await digestMails()).length
    const res = await request(t.app).post('/api/v1/admin/jobs/weekly-digest/run').set('Authorization', admin)
    expect(res.status).toBe(200)
    expect(res.body.job).toBe('weekly-digest')
    const managers = await t.db('users').where({ role: 'manager', active: true }).pluck('email')
    expect(managers.length).toBeGreaterThan(0)
    const mails = (await digestMails()).slice(before)
    expect(mails.map((m) => m.toAddress).sort()).toEqual([...managers].sort())
    const m = mails[0]
    // The week ends at the run's clock: Monday 7 Dec 2026 (hand check: 2 Dec 2026 is a Wednesday).
    expect(m.subject).toBe('Lampwright weekly digest: week to Mon, 7 Dec 2026')
    // By hand from the fixture above: late now = C = 1; dark hours = 30 (A) + 24 (B) = 54.0;
    // found this week = A and C = 2; fixed this week = A and B = 2; no visits, so 0 lamps.
    expect(m.text).toContain(
      `- ${FIXTURE}: 1 fault past contract time now · 54.0 dark hours · 2 faults found · 2 fixed · 0 lamps replaced`,
    )
    // The fixture certificate falls due on the digest's own day.
    expect(m.text).toContain(
      `- ${PLATFORM.assetTag} ${PLATFORM.name}: Platform thorough examination due Mon, 7 Dec 2026`,
    )
  })

  it('runs the queue refresh, and answers an unknown job with 404 unknown_job', async () => {
    const ok = await request(t.app).post('/api/v1/admin/jobs/queue-refresh/run').set('Authorization', admin)
    expect(ok.status).toBe(200)
    expect(ok.body.job).toBe('queue-refresh')
    const unknown = await request(t.app)
      .post('/api/v1/admin/jobs/tidy-everything/run')
      .set('Authorization', admin)
    expect(unknown.status).toBe(404)
    expect(unknown.body.error.code).toBe('unknown_job')
  })

  it('is for admins only', async () => {
    const res = await request(t.app)
      .post('/api/v1/admin/jobs/weekly-digest/run')
      .set('Authorization', `Bearer ${await t.token('manager')}`)
    expect(res.status).toBe(403)
  })

  it('answers 409 job_running while another connection holds the job’s lock, and sends nothing', async () => {
    const before = (await digestMails()).length
    const held = await withNamedLock(t.db, 'weekly-digest', () =>
      request(t.app).post('/api/v1/admin/jobs/weekly-digest/run').set('Authorization', admin),
    )
    expect(held.ran).toBe(true)
    if (held.ran) {
      expect(held.result.status).toBe(409)
      expect(held.result.body.error.code).toBe('job_running')
    }
    expect((await digestMails()).length).toBe(before)
  })

  it('runs a scheduled time once, even when a second process fires after the first is done', async () => {
    const before = (await digestMails()).length
    const managers = await t.db('users').where({ role: 'manager', active: true }).count({ n: '*' })
    const first = await runScheduled('weekly-digest', t.deps, NOW)
    const second = await runScheduled('weekly-digest', t.deps, new Date(NOW.getTime() + 20_000))
    expect(first.ran && second.ran).toBe(true)
    expect(second.ran && second.result).toEqual({ skipped: 'already run for this time' })
    expect((await digestMails()).length - before).toBe(Number(managers[0].n))
  })
})
