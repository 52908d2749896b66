// A report's loop closing: scheduled when a published run holds it, fixed with the fixed e-mail when
// its item closes (linked reports too), still fixed two refreshes later, and its address erased by
// the link in either e-mail.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomInt } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { refreshQueue } from '../../server/jobs/refresh-queue'
import { markReportsScheduled, settleReportsOfItems } from '../../server/services/queue/reports'
import { freeString, mailTo, newEmail, tokenOf } from './reporters-helpers'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp({ TRUST_PROXY: 'loopback' })
})
afterAll(() => t.close())

const from = () => ({ 'X-Forwarded-For': `198.51.100.${randomInt(1, 255)}` })
const aMinuteAgo = () => Date.now() - 60_000
async function report(tag: string, email?: string) {
  const res = await request(t.app)
    .post('/api/v1/reports')
    .set(from())
    .send({ tag, description: 'The lights are out.', email, formStartedAt: aMinuteAgo() })
  expect(res.status).toBe(201)
  const row = await t.db('reports').where({ ref: res.body.ref }).first('id', 'queueItemId')
  return { ref: res.body.ref as string, id: row.id as number, itemId: row.queueItemId as number }
}
const status = async (ref: string) => (await request(t.app).get(`/api/v1/reports/${ref}`)).body

describe('the loop closes', () => {
  it('is scheduled by a published run that holds it, then fixed with one e-mail to each reporter', async () => {
    const tag = await freeString(t)
    const [e1, e2] = [newEmail(), newEmail()]
    const first = await report(tag, e1)
    const second = await report(tag, e2)
    expect(second.itemId).toBe(first.itemId)

    // A published run with a stop for the item (a date far off, so no other run is in the way).
    const crew = await t.db('crews').orderBy('id').first('id')
    const runDate = `2031-0${randomInt(1, 10)}-${String(randomInt(10, 29))}`
    await t.db('runs').where({ crewId: crew.id, runDate }).delete()
    const [runId] = await t.db('runs').insert({ crewId: crew.id, runDate, state: 'published', version: 1 })
    await t.db('runStops').insert({ runId, position: 1, queueItemId: first.itemId })
    await t.db.transaction((trx) => markReportsScheduled(trx, [runId]))
    for (const r of [first, second]) expect((await status(r.ref)).state).toBe('scheduled')

    // What a visit fixing the string does through closeItems → settleReports (the lead wires it there).
    const { mailIds } = await t.db.transaction((trx) => settleReportsOfItems(trx, [first.itemId], 'fixed'))
    expect(mailIds).toHaveLength(2)
    await t.deps.mailer.deliverDue?.({ ids: mailIds })
    for (const [r, e] of [
      [first, e1],
      [second, e2],
    ] as const) {
      const s = await status(r.ref)
      expect(s.state).toBe('fixed')
      expect(s.stateLabel).toBe('Fixed')
      expect(s.history.map((h: { state: string }) => h.state)).toEqual(['received', 'scheduled', 'fixed'])
      expect((await mailTo(t, e, 1)).subject).toBe(`Fixed: your fault report ${r.ref}`)
    }
    await t.db('runs').where({ id: runId }).delete()
  })

  it('closed by a supervisor, the linked report follows and both stay closed two refreshes later', async () => {
    const tag = await freeString(t)
    const email = newEmail()
    const first = await report(tag)
    const second = await report(tag, email)
    const token = await t.token('supervisor')
    const closed = await request(t.app)
      .post(`/api/v1/queue/${first.itemId}/close`)
      .set('Authorization', `Bearer ${token}`)
      .send({ reason: 'Fixed by the day crew', reportState: 'fixed' })
    expect(closed.status).toBeLessThan(300)
    await refreshQueue(t.db)
    await refreshQueue(t.db)
    await t.deps.mailer.deliverDue?.()
    for (const r of [first, second]) expect((await status(r.ref)).state).toBe('fixed')
    expect(
      await t
        .db('queueItems')
        .where({ kind: 'public_report' })
        .whereIn('reportId', [first.id, second.id])
        .whereIn('state', ['open', 'snoozed']),
    ).toHaveLength(0)
    expect((await mailTo(t, email, 1)).subject).toBe(`Fixed: your fault report ${second.ref}`)
    // One fixed e-mail only, however many refreshes.
    expect(await t.db('emailOutbox').where({ toAddress: email, topic: 'report_fixed' })).toHaveLength(1)
  })
})

describe('erasing the address', () => {
  it('removes the address with the token from the e-mail; a wrong token is 404, a second use is fine', async () => {
    const email = newEmail()
    const r = await report(await freeString(t), email)
    const token = tokenOf((await mailTo(t, email)).text)
    const wrong = await request(t.app)
      .post(`/api/v1/reports/${r.ref}/erase-email`)
      .set(from())
      .send({ token: 'x'.repeat(32) })
    expect(wrong.status).toBe(404)
    const erase = await request(t.app)
      .post(`/api/v1/reports/${r.ref}/erase-email`)
      .set(from())
      .send({ token })
    expect(erase.status).toBe(200)
    expect(erase.body).toEqual({ erased: true })
    const row = await t.db('reports').where({ id: r.id }).first('reporterEmail', 'reporterName')
    expect(row).toEqual({ reporterEmail: null, reporterName: null })
    expect(await t.db('emailOutbox').where({ toAddress: email })).toHaveLength(0)
    const again = await request(t.app)
      .post(`/api/v1/reports/${r.ref}/erase-email`)
      .set(from())
      .send({ token })
    expect(again.status).toBe(200)
    // With the address gone, the fix sends nothing.
    const { mailIds } = await t.db.transaction((trx) => settleReportsOfItems(trx, [r.itemId], 'fixed'))
    expect(mailIds).toEqual([])
  })
})
