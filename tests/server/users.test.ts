import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import { createAccount, tokenFor } from './account-helpers'

let t: TestApp
let admin: string
beforeAll(async () => {
  t = await makeTestApp()
  admin = `Bearer ${await t.token('admin')}`
})
afterAll(() => t.close())

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/

describe('request ids in the audit log', () => {
  it('replaces a long X-Request-Id; the change and its audit row are both saved', async () => {
    const a = await createAccount(t, 'crew')
    const long = 'x'.repeat(100)
    const res = await request(t.app)
      .patch(`/api/v1/users/${a.id}`)
      .set('Authorization', admin)
      .set('X-Request-Id', long)
      .send({ role: 'supervisor' })
    expect(res.status).toBe(200)
    expect(res.body.user.role).toBe('supervisor')
    const id = res.headers['x-request-id']
    expect(id).toMatch(UUID)
    const row = await t.db('auditLog').where({ entity: 'user', entityId: a.id, action: 'update' }).first()
    expect(row.requestId).toBe(id)
  })

  it('replaces an id with unsafe characters and keeps a short plain one', async () => {
    const a = await createAccount(t, 'crew')
    const odd = await request(t.app).get('/api/v1/health').set('X-Request-Id', 'abc <script>')
    expect(odd.headers['x-request-id']).toMatch(UUID)
    const plain = 'phone-7.retry_2'
    const res = await request(t.app)
      .patch(`/api/v1/users/${a.id}`)
      .set('Authorization', admin)
      .set('X-Request-Id', plain)
      .send({ role: 'manager' })
    expect(res.headers['x-request-id']).toBe(plain)
    const row = await t.db('auditLog').where({ entityId: a.id, action: 'update' }).first('requestId')
    expect(row.requestId).toBe(plain)
  })

  it('writes the invitation and its audit row together', async () => {
    const email = `audited.${Date.now()}@example.org`
    const res = await request(t.app)
      .post('/api/v1/users')
      .set('Authorization', admin)
      .send({ name: 'Audited Invitee', email, role: 'crew' })
    expect(res.status).toBe(201)
    const row = await t.db('auditLog').where({ action: 'invite', entityId: res.body.user.id }).first()
    expect(row.requestId).toBe(res.headers['x-request-id'])
  })
})

describe('the last active admin', () => {
  it('two admins demoting each other at once leave exactly one active admin', async () => {
    // Only the two admins made here may be active during the race; the others come back after.
    const others = (await t.db('users').where({ role: 'admin', active: true }).select('id')).map(
      (r: { id: number }) => r.id,
    )
    await t.db('users').whereIn('id', others).update({ active: false })
    try {
      const a = await createAccount(t, 'admin')
      const b = await createAccount(t, 'admin')
      const [ta, tb] = [await tokenFor(t, a), await tokenFor(t, b)]
      // Hold the admins' rows so both requests are signed in and waiting on the same lock before either
      // runs: the race happens every time instead of by chance.
      const hold = await t.db.transaction()
      await hold('users').where({ role: 'admin', active: true }).forUpdate().select('id')
      const racing = Promise.all([
        request(t.app)
          .patch(`/api/v1/users/${b.id}`)
          .set('Authorization', `Bearer ${ta}`)
          .send({ role: 'crew' }),
        request(t.app)
          .patch(`/api/v1/users/${a.id}`)
          .set('Authorization', `Bearer ${tb}`)
          .send({ active: false }),
      ])
      await waitForLockWaiters(2)
      await hold.commit()
      const results = await racing
      expect(results.map((r) => r.status).sort()).toEqual([200, 409])
      expect(results.find((r) => r.status === 409)!.body.error.code).toBe('last_admin')
      const left = await t.db('users').where({ role: 'admin', active: true }).select('id')
      expect(left).toHaveLength(1)
      expect([a.id, b.id]).toContain(left[0].id)
      await t.db('users').whereIn('id', [a.id, b.id]).update({ active: false })
    } finally {
      await t.db('users').whereIn('id', others).update({ active: true })
    }
  })
})

/** Waits until `n` other connections of ours are blocked in a locking read (SELECT … FOR UPDATE). */
async function waitForLockWaiters(n: number): Promise<void> {
  for (let i = 0; i < 200; i++) {
    const [rows] = await t.db.raw(
      `SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST
       WHERE ID <> CONNECTION_ID() AND COMMAND = 'Query' AND INFO LIKE '%for update%'`,
    )
    if (Number(rows[0].n) >= n) return
    await new Promise((r) => setTimeout(r, 25))
  }
  throw new Error(`fewer than ${n} requests reached the admins' lock`)
}
