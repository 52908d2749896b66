// Helpers for the report-work and report-emergency tests: a public report from its own address, a quiet
// string to put it on, and the whole queue read page by page.
import { expect } from 'vitest'
import request from 'supertest'
import { randomInt } from 'node:crypto'
import type { TestApp } from './helpers'

// Each report from its own documentation address (RFC 5737 TEST-NET-2), so the per-address limit
// counts only its own; a form opened a minute ago passes the 3 s minimum fill time.
export const from = () => ({ 'X-Forwarded-For': `198.51.100.${randomInt(1, 255)}` })

/** A string with no waiting report, not over the carriageway (no platform needed), at the least important site. */
export async function quietString(t: TestApp, exclude: number[] = []) {
  const row = await t
    .db('strings as s')
    .join('sites as si', 'si.id', 's.siteId')
    .whereNull('s.archivedAt')
    .whereNot('s.geometry', 'line')
    .whereNull('si.accessFrom')
    .whereNotIn('s.id', exclude.length ? exclude : [0])
    .whereNotIn(
      's.id',
      t
        .db('reports')
        .whereIn('state', ['received', 'in_hand', 'scheduled'])
        .whereNotNull('stringId')
        .select('stringId'),
    )
    .orderBy([{ column: 'si.importance' }, { column: 's.id' }])
    .first('s.id', 's.assetTag', 'si.importance')
  return row as { id: number; assetTag: string; importance: number }
}

export async function report(t: TestApp, body: Record<string, unknown>) {
  const res = await request(t.app)
    .post('/api/v1/reports')
    .set(from())
    .send({ formStartedAt: Date.now() - 60_000, ...body })
  expect(res.status).toBe(201)
  const row = await t.db('reports').where({ ref: res.body.ref }).first('id', 'queueItemId')
  return { ref: res.body.ref as string, photoKey: res.body.photoKey as string, ...row }
}

/** Every item of the queue under `query`, page by page, in the order the API gives. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- queue items as the API answers them
type Item = Record<string, any>
export async function wholeQueue(app: TestApp, auth: string, query = ''): Promise<Item[]> {
  const out: Item[] = []
  for (let page = 1; page < 50; page++) {
    const res = await request(app.app)
      .get(`/api/v1/queue?pageSize=100&page=${page}${query}`)
      .set('Authorization', auth)
    expect(res.status).toBe(200)
    out.push(...res.body.items)
    if (out.length >= res.body.total || !res.body.items.length) break
  }
  return out
}
