// Hazard reports are emergencies (issue 12 part 2): ranked above every routine item in the queue and the
// planner whatever the score, and closed from the crew's stop by an emergency log that is stored once
// per Idempotency-Key, audited, and moves the report to "Fixed".
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { randomUUID } from 'node:crypto'
import { mkdtemp, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { makeTestApp, type TestApp } from './helpers'
import { quietString, report, wholeQueue } from './report-work-helpers'
import { openItem } from '../../server/services/queue/items'
import { loadItems } from '../../server/services/run-items'
import { localFileStore } from '../../server/files/local-store'
import { png } from '../fixtures/photos/build'

let t: TestApp
let dir: string
beforeAll(async () => {
  t = await makeTestApp({ TRUST_PROXY: 'loopback' })
  dir = await mkdtemp(join(tmpdir(), 'lampwright-emergency-'))
  t.deps.files = localFileStore(dir)
})
afterAll(async () => {
  await rm(dir, { recursive: true, force: true })
  await t.close()
})

const bearer = async (role: 'crew' | 'supervisor') => `Bearer ${await t.token(role)}`
const HOUR = 3_600_000

/** A dark string at the most important site, its item opened three days ago and due a day ago. */
async function overdueDarkItem() {
  const s = await t
    .db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .whereNull('s.archivedAt')
    .whereNotIn(
      's.id',
      t.db('queueItems').whereIn('state', ['open', 'snoozed']).whereNotNull('stringId').select('stringId'),
    )
    .orderBy([{ column: 'si.importance', order: 'desc' }, { column: 's.id' }])
    .first('s.id', 's.siteId', 'si.clientId', 'si.importance')
  await t.db('strings').where({ id: s.id }).update({ status: 'dark', dark: true })
  const now = Date.now()
  const id = await openItem(t.db, {
    kind: 'dark',
    subject: `string:${s.id}`,
    severity: 'standard',
    stringId: s.id,
    siteId: s.siteId,
    clientId: s.clientId,
    openedAt: new Date(now - 72 * HOUR),
    dueBy: new Date(now - 24 * HOUR),
    summary: 'Dark string (test)',
  })
  return { id, importance: s.importance as number }
}

describe('hazard reports rank first', () => {
  it('puts a hazard report above a dark, overdue string at an important site, in the queue and the planner', async () => {
    const dark = await overdueDarkItem()
    expect(dark.importance).toBe(5)
    const s = await quietString(t)
    const hazard = await report(t, {
      tag: s.assetTag,
      description: 'Wires hanging down, sparking.',
      hazard: true,
    })
    const all = await wholeQueue(t, await bearer('supervisor'))
    const darkItem = all.find((i) => i.id === dark.id)!
    const hazardItem = all.find((i) => i.id === hazard.queueItemId)!
    expect(hazardItem.severity).toBe('emergency')
    // Hand calculation from score.ts: the dark item is risk 45 + importance 5 × 5 = 25 + clock 25 (its due
    // time has passed) = 95; the hazard is risk 50 + importance 5 × (its site's, at most 4 here) ≤ 20 +
    // a clock a few seconds old (≈ 0) ≤ 70.1. So it comes first only because emergencies lead.
    expect(darkItem.score).toBe(95)
    expect(s.importance).toBeLessThanOrEqual(4)
    expect(hazardItem.score).toBeLessThan(darkItem.score)
    expect(all.indexOf(hazardItem)).toBeLessThan(all.indexOf(darkItem))
    // Every emergency before every routine item.
    const firstRoutine = all.findIndex((i) => i.severity !== 'emergency')
    expect(all.slice(firstRoutine).some((i) => i.severity === 'emergency')).toBe(false)
    const planned = await loadItems(t.db, [dark.id, hazard.queueItemId])
    expect(planned.get(hazard.queueItemId)!.priority).toBeGreaterThan(planned.get(dark.id)!.priority)
  })
})

describe('the emergency log', () => {
  const log = async (itemId: number, key: string, body: Record<string, unknown>) =>
    request(t.app)
      .post(`/api/v1/queue/${itemId}/emergency-log`)
      .set('Authorization', await bearer('crew'))
      .set('Idempotency-Key', key)
      .send(body)

  it('closes the item, the report reads Fixed, and a replayed key stores one log', async () => {
    const s = await quietString(t)
    const r = await report(t, {
      tag: s.assetTag,
      description: 'Column door open, wires showing.',
      hazard: true,
    })
    const key = randomUUID()
    const body = {
      found: 'Column door forced, live terminals exposed.',
      did: 'Isolated, fitted a new door and lock.',
      outcome: 'fixed',
    }
    const first = await log(r.queueItemId, key, body)
    expect(first.status).toBe(201)
    expect(first.body).toMatchObject({
      itemId: r.queueItemId,
      stringId: s.id,
      outcome: 'fixed',
      itemClosed: true,
    })
    const replay = await log(r.queueItemId, key, body)
    expect(replay.status).toBe(200)
    expect(replay.body.id).toBe(first.body.id)
    expect(await t.db('emergencyLogs').where({ idempotencyKey: key }).count({ n: '*' })).toEqual([{ n: 1 }])
    expect((await t.db('queueItems').where({ id: r.queueItemId }).first('state')).state).toBe('closed')
    const status = await request(t.app).get(`/api/v1/reports/${r.ref}`)
    expect(status.body.state).toBe('fixed')
    expect(status.body.stateLabel).toBe('Fixed')
    const audit = await t
      .db('auditLog')
      .where({ action: 'emergency_log', entityId: r.queueItemId })
      .select('id')
    expect(audit).toHaveLength(1)
    // Its photo: once, checked by its bytes like field photos; a repeat answers 200 with the same log.
    const attach = async () =>
      request(t.app)
        .post(`/api/v1/emergency-logs/${first.body.id}/photo`)
        .set('Authorization', await bearer('crew'))
        .attach('photo', await png(), { filename: 'after.png', contentType: 'image/png' })
    expect((await attach()).status).toBe(201)
    const twice = await attach()
    expect(twice.status).toBe(200)
    expect(twice.body.photo.thumbUrl).toBe(`/api/v1/emergency-logs/${first.body.id}/photo/thumb`)
    const thumb = await request(t.app)
      .get(twice.body.photo.thumbUrl)
      .set('Authorization', await bearer('crew'))
    expect(thumb.headers['content-type']).toBe('image/jpeg')
    const notes = await request(t.app)
      .get(`/api/v1/strings/${s.id}/work-notes`)
      .set('Authorization', await bearer('crew'))
    expect(notes.body.emergencyLogs[0]).toMatchObject({ id: first.body.id, found: body.found, did: body.did })
    expect(notes.body.emergencyLogs[0].photo).not.toBeNull()
    expect(notes.body.reports).toEqual([])
  })

  it('made safe but needing more work: the item stays open as routine work and the report is in hand', async () => {
    const s = await quietString(t)
    const r = await report(t, { tag: s.assetTag, description: 'Festoon down across the path.', hazard: true })
    const res = await log(r.queueItemId, randomUUID(), {
      found: 'Festoon down, catenary wire snapped.',
      did: 'Cut free and coiled it off the path; needs a new catenary.',
      outcome: 'made_safe',
    })
    expect(res.status).toBe(201)
    expect(res.body.itemClosed).toBe(false)
    const item = await t.db('queueItems').where({ id: r.queueItemId }).first('state', 'severity', 'summary')
    expect(item).toMatchObject({ state: 'open', severity: 'standard' })
    expect(item.summary).toMatch(/ · made safe by the crew, needs more work$/)
    expect((await request(t.app).get(`/api/v1/reports/${r.ref}`)).body.state).toBe('in_hand')
  })

  it('refuses a routine item (log a visit there) and needs an Idempotency-Key', async () => {
    const s = await quietString(t)
    const r = await report(t, { tag: s.assetTag, description: 'Two lamps out at the end.' })
    const body = { found: 'Two lamps out.', did: 'Replaced them.', outcome: 'fixed' }
    const res = await log(r.queueItemId, randomUUID(), body)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('not_emergency')
    const noKey = await request(t.app)
      .post(`/api/v1/queue/${r.queueItemId}/emergency-log`)
      .set('Authorization', await bearer('crew'))
      .send(body)
    expect(noKey.status).toBe(400)
  })
})
