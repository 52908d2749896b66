// Mail that arrives: failed sends wait and are tried again (1, 5, 15, 60 minutes, then failed for
// good), driven by the retry job on an injected clock; admins see what keeps failing and send it again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { createMailer, createTransport, type Mailer } from '../../server/mail/mailer'
import { startFakeSmtp } from '../../server/mail/fake-smtp'
import { claimDue, type MailTransport } from '../../server/mail/outbox'
import { retryMail } from '../../server/jobs/mail-retry'

let t: TestApp
let fake: Awaited<ReturnType<typeof startFakeSmtp>>
let delivered: MailTransport
beforeAll(async () => {
  t = await makeTestApp()
  fake = await startFakeSmtp(t.db, 0)
  delivered = createTransport(undefined, fake.port)
})
afterAll(async () => {
  await fake.close()
  await t.close()
})

const MIN = 60_000
// Whole seconds: DATETIME columns keep no fractions, so a due time must not round past the clock.
const wholeSecond = () => new Date(Math.floor(Date.now() / 1000) * 1000)

/** A transport that refuses `to` for its first `failures` attempts and delivers everything else. */
function flaky(to: string, failures: number) {
  const calls = { count: 0 }
  const transport: MailTransport = {
    async sendMail(mail) {
      if (mail.to === to && calls.count++ < failures) throw new Error('451 mailbox busy (test)')
      return delivered.sendMail(mail)
    },
  }
  return { transport, calls }
}

function clockedMailer(transport: MailTransport, start: Date): { mailer: Mailer; at(ms: number): void } {
  let now = start
  const mailer = createMailer(t.db, transport, 'Lampwright <no-reply@lampwright.example>', { now: () => now })
  return { mailer, at: (ms) => (now = new Date(start.getTime() + ms)) }
}

const row = (id: number) => t.db('emailOutbox').where({ id }).first()

describe('retrying mail', () => {
  it('a send that fails twice is retried by the job and delivered on the third attempt', async () => {
    const to = `retry.${randomUUID().slice(0, 8)}@example.org`
    const subject = `Retry check ${to}`
    const { transport, calls } = flaky(to, 2)
    const t0 = wholeSecond()
    const { mailer, at } = clockedMailer(transport, t0)

    const first = await mailer.send({ to, subject, text: 'Hello', topic: 'test' })
    expect(first.sent).toBe(false)
    // Attempt 1 failed at t0; the first wait is 1 minute, so the next attempt is due at t0 + 1 min.
    expect(await row(first.id)).toMatchObject({ state: 'queued', attempts: 1 })
    expect((await row(first.id)).nextAttemptAt.getTime()).toBe(t0.getTime() + 1 * MIN)

    at(1 * MIN - 1000) // one second early: nothing to do for this message
    await retryMail(mailer)
    expect(await row(first.id)).toMatchObject({ state: 'queued', attempts: 1 })

    at(1 * MIN) // attempt 2 fails; the second wait is 5 minutes: due at t0 + 1 + 5 = t0 + 6 min
    await retryMail(mailer)
    expect(await row(first.id)).toMatchObject({ state: 'queued', attempts: 2 })
    expect((await row(first.id)).nextAttemptAt.getTime()).toBe(t0.getTime() + 6 * MIN)

    at(6 * MIN) // attempt 3 goes through
    await retryMail(mailer)
    const sent = await row(first.id)
    expect(sent).toMatchObject({ state: 'sent', attempts: 3 })
    expect(sent.sentAt.getTime()).toBe(t0.getTime() + 6 * MIN)
    expect(calls.count).toBe(3)
    const caught = await t.db('caughtMail').where({ toAddress: to, subject })
    expect(caught).toHaveLength(1)
  })

  it('a message that keeps failing fails for good after five attempts, is listed for admins, and can be sent again', async () => {
    const to = `bounce.${randomUUID().slice(0, 8)}@example.org`
    const { transport } = flaky(to, Number.POSITIVE_INFINITY)
    const t0 = wholeSecond()
    const { mailer, at } = clockedMailer(transport, t0)
    const { id } = await mailer.send({ to, subject: `Never arrives ${to}`, text: 'Hello', topic: 'test' })
    // Waits 1, 5, 15, 60 min after attempts 1-4: attempts at 0, 1, 6, 21 and 81 minutes; the 5th is final.
    for (const minute of [1, 6, 21, 81]) {
      at(minute * MIN)
      await retryMail(mailer)
    }
    expect(await row(id)).toMatchObject({ state: 'failed', attempts: 5, nextAttemptAt: null })

    const admin = `Bearer ${await t.token('admin')}`
    const list = await request(t.app).get('/api/v1/email-outbox/failing').set('Authorization', admin)
    expect(list.status).toBe(200)
    const listed = list.body.items.find((m: { id: number }) => m.id === id)
    expect(listed).toMatchObject({ to, state: 'failed', attempts: 5, lastError: '451 mailbox busy (test)' })
    expect(listed.text).toBeUndefined() // never the body: reset and invitation links live there

    const crew = `Bearer ${await t.token('crew')}`
    expect((await request(t.app).get('/api/v1/email-outbox/failing').set('Authorization', crew)).status).toBe(
      403,
    )

    // "Send again" uses the app's own mailer (the working mail fake): delivered at once.
    const again = await request(t.app)
      .post(`/api/v1/email-outbox/${id}/send-again`)
      .set('Authorization', admin)
    expect(again.status).toBe(200)
    expect(again.body.message).toMatchObject({ id, state: 'sent', attempts: 1 })
    expect(await t.db('caughtMail').where({ toAddress: to })).toHaveLength(1)
    const twice = await request(t.app)
      .post(`/api/v1/email-outbox/${id}/send-again`)
      .set('Authorization', admin)
    expect(twice.status).toBe(409)
    expect(twice.body.error.code).toBe('mail_not_failed')
  })

  it('two processes claiming at the same moment never take the same message', async () => {
    const now = wholeSecond()
    const ids: number[] = []
    for (let i = 0; i < 6; i++) {
      const [id] = await t.db('emailOutbox').insert({
        toAddress: `claim.${i}@example.org`,
        subject: `Claim ${randomUUID()}`,
        text: 'x',
        topic: 'test',
        state: 'queued',
        attempts: 1,
        nextAttemptAt: now,
      })
      ids.push(id)
    }
    const [a, b] = await Promise.all([claimDue(t.db, now, { ids }), claimDue(t.db, now, { ids })])
    const taken = [...a.rows, ...b.rows].map((r) => r.id).sort((x, y) => x - y)
    expect(taken).toEqual(ids) // each of the six exactly once
  })
})
