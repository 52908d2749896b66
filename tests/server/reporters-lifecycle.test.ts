// Public reports hear back (issue 12 part 1): acknowledgement e-mail with a working status link, the
// robot guards (honeypot, too-fast form) that answer 201 and keep nothing, reports on one string
// sharing one queue item, the history on the status page, the fixed e-mail, and the erase link.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomInt } from 'node:crypto'
import { makeTestApp, type TestApp } from './helpers'
import { refreshQueue } from '../../server/jobs/refresh-queue'
import { freeString, mailTo, newEmail, refOf } from './reporters-helpers'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp({ TRUST_PROXY: 'loopback', PUBLIC_URL: 'https://lights.example.org' })
})
afterAll(() => t.close())

// Each test posts from its own documentation address (RFC 5737 TEST-NET-2), so the limit of ten
// reports per address an hour counts only its own.
const from = () => ({ 'X-Forwarded-For': `198.51.100.${randomInt(1, 255)}` })
const post = (body: Record<string, unknown>) => request(t.app).post('/api/v1/reports').set(from()).send(body)
// A person who took a minute over the form: 60 000 ms ≥ the 3 000 ms minimum.
const aMinuteAgo = () => Date.now() - 60_000
const counts = async () => ({
  reports: Number((await t.db('reports').count({ n: '*' }))[0].n),
  items: Number((await t.db('queueItems').count({ n: '*' }))[0].n),
  mail: Number((await t.db('emailOutbox').count({ n: '*' }))[0].n),
})

describe('acknowledgement and status', () => {
  it('mails the reference with a status link that works, and the status shows nothing personal', async () => {
    const email = newEmail()
    const tag = await freeString(t)
    const res = await post({
      tag,
      description: 'Three lamps out near the bus stop.',
      landmark: 'Outside number 12',
      name: 'Pat Example',
      email,
      formStartedAt: aMinuteAgo(),
    })
    expect(res.status).toBe(201)
    const mail = await mailTo(t, email)
    expect(mail.subject).toBe(`We have your fault report ${res.body.ref}`)
    // The link is PUBLIC_URL + /report?ref=…, the page that reads the status.
    const link = /https:\/\/lights\.example\.org\/report\?ref=(LW-[0-9A-Z]{5})\s/.exec(mail.text)
    expect(link?.[1]).toBe(res.body.ref)
    expect(mail.html).toContain(`https://lights.example.org/report?ref=${res.body.ref}`)
    const status = await request(t.app).get(`/api/v1/reports/${refOf(mail.text)}`)
    expect(status.status).toBe(200)
    expect(status.body.state).toBe('received')
    expect(status.body.history).toEqual([
      { state: 'received', stateLabel: 'Received', at: status.body.createdAt, publicNote: null },
    ])
    // Nothing personal: only these keys, and none of the name, address, words or place.
    expect(Object.keys(status.body).sort()).toEqual(
      ['createdAt', 'history', 'publicNote', 'ref', 'state', 'stateLabel', 'street', 'updatedAt'].sort(),
    )
    const seen = JSON.stringify(status.body)
    for (const personal of [email, 'Pat Example', 'bus stop', 'number 12'])
      expect(seen).not.toContain(personal)
  })

  it('sends no mail to a reporter who gave no address', async () => {
    const before = await counts()
    const res = await post({
      street: 'Harbour Street',
      description: 'Lights off tonight.',
      formStartedAt: aMinuteAgo(),
    })
    expect(res.status).toBe(201)
    const after = await counts()
    expect(after.reports).toBe(before.reports + 1)
    expect(after.mail).toBe(before.mail)
  })
})

describe('robot guards', () => {
  it('answers a filled honeypot with a normal 201 and stores, queues and mails nothing', async () => {
    const before = await counts()
    const res = await post({
      tag: await freeString(t),
      description: 'Cheap watches here.',
      email: newEmail(),
      website: 'https://spam.example',
      formStartedAt: aMinuteAgo(),
    })
    expect(res.status).toBe(201)
    expect(res.body.ref).toMatch(/^LW-[0-9A-HJKMNP-TV-Z]{5}$/)
    expect(res.body.state).toBe('received')
    expect(await counts()).toEqual(before)
    expect((await request(t.app).get(`/api/v1/reports/${res.body.ref}`)).status).toBe(404)
  })

  it('treats a form sent 1 s after it opened like the honeypot, and one sent after 5 s as a person', async () => {
    const before = await counts()
    // 1 000 ms < the 3 000 ms minimum fill time.
    const fast = await post({
      street: 'Harbour Street',
      description: 'Lamps out.',
      email: newEmail(),
      formStartedAt: Date.now() - 1_000,
    })
    expect(fast.status).toBe(201)
    expect(await counts()).toEqual(before)
    // 5 000 ms ≥ 3 000 ms: stored, with its item and its acknowledgement.
    const person = await post({
      street: 'Harbour Street',
      description: 'Lamps out.',
      email: newEmail(),
      formStartedAt: Date.now() - 5_000,
    })
    expect(person.status).toBe(201)
    const after = await counts()
    expect(after.reports).toBe(before.reports + 1)
    expect(after.mail).toBe(before.mail + 1)
    // A phone clock two minutes ahead of ours: -120 000 ms tells us nothing, so it counts as a person.
    const ahead = await post({
      street: 'Harbour Street',
      description: 'Lamps out.',
      formStartedAt: Date.now() + 120_000,
    })
    expect(ahead.status).toBe(201)
    expect((await counts()).reports).toBe(before.reports + 2)
  })
})

describe('one string, one item', () => {
  it('links a second report on the same string to the first one’s open item; both references work', async () => {
    const tag = await freeString(t)
    const a = await post({ tag, description: 'Half the string is dark.', formStartedAt: aMinuteAgo() })
    const b = await post({
      tag,
      description: 'Cable hanging low over the path.',
      hazard: true,
      formStartedAt: aMinuteAgo(),
    })
    expect([a.status, b.status]).toEqual([201, 201])
    const rows = await t
      .db('reports')
      .whereIn('ref', [a.body.ref, b.body.ref])
      .select('id', 'queueItemId', 'stringId')
    expect(rows[0].queueItemId).not.toBeNull()
    expect(rows[1].queueItemId).toBe(rows[0].queueItemId)
    const items = await t
      .db('queueItems')
      .where({ kind: 'public_report', stringId: rows[0].stringId })
      .whereIn('state', ['open', 'snoozed'])
    expect(items).toHaveLength(1)
    // The second report named a hazard: the shared item is an emergency now.
    expect(items[0].severity).toBe('emergency')
    await refreshQueue(t.db)
    expect(
      await t
        .db('queueItems')
        .where({ kind: 'public_report', stringId: rows[0].stringId })
        .whereIn('state', ['open', 'snoozed']),
    ).toHaveLength(1)
    for (const ref of [a.body.ref, b.body.ref])
      expect((await request(t.app).get(`/api/v1/reports/${ref}`)).status).toBe(200)
  })
})
