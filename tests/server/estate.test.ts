// The estate API: create the chain client → site → supply point → circuit → type → string, edit with
// optimistic locking, archive, field errors, roles and audit rows (issue 10 item 1).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import type { Role } from '../../shared/roles'
import { kindDef } from '../../server/services/estate/kinds'
import { updateKind } from '../../server/services/estate/crud'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
})
afterAll(() => t.close())

const run = Date.now().toString(36).toUpperCase()
const as = async (role: Role) => `Bearer ${await t.token(role)}`
const post = async (role: Role, kind: string, body: object) =>
  request(t.app)
    .post(`/api/v1/${kind}`)
    .set('Authorization', await as(role))
    .send(body)

const client = {
  name: `Estate test council ${run}`,
  kind: 'council',
  responseEmergencyHours: 4,
  responseStandardHours: 48,
  switchOn: '16:00',
  switchOff: '23:30',
  tariffPerKwh: 0.31,
  timeZone: 'Europe/London',
}
const typeBody = {
  code: `ET-${run}`.slice(0, 30),
  name: 'Test festoon 20 lamps',
  technology: 'filament',
  supplyVolts: 230,
  ratedLifeHours: 3000,
  lampClasses: [{ label: 'lamp', count: 20, ratedVolts: 11.5, ratedAmps: 0.1, shunted: true }],
}

const ids: Record<string, number> = {}

describe('estate chain', () => {
  it('creates client → site → supply point → circuit → string type → string', async () => {
    const c = await post('manager', 'clients', client)
    expect(c.status).toBe(201)
    expect(c.body).toMatchObject({
      version: 1,
      archivedAt: null,
      timeZone: 'Europe/London',
      switchMode: 'fixed',
    })
    ids.client = c.body.id
    const site = await post('manager', 'sites', {
      clientId: ids.client,
      name: 'High Street',
      kind: 'street',
      lat: 51.5,
      lng: -0.12,
    })
    expect(site.status).toBe(201)
    ids.site = site.body.id
    const sp = await post('admin', 'supply-points', {
      siteId: ids.site,
      ref: `SP-${run}`,
      name: 'Feeder pillar',
      lat: 51.5,
      lng: -0.12,
    })
    expect(sp.status).toBe(201)
    const circuit = await post('admin', 'circuits', {
      supplyPointId: sp.body.id,
      ref: `C-${run}`,
      supplyVolts: 230,
      breakerAmps: 16,
      breakerCurve: 'C',
      rcdMa: 30,
      rcdType: 'general',
    })
    expect(circuit.status).toBe(201)
    ids.circuit = circuit.body.id
    const type = await post('manager', 'string-types', typeBody)
    expect(type.status).toBe(201)
    // A class's own life settings are null ("the type's") when not given.
    expect(type.body.lampClasses).toEqual(
      typeBody.lampClasses.map((c) => ({ ...c, ratedLifeHours: null, lifeExponent: null })),
    )
    ids.type = type.body.id
    const s = await post('manager', 'strings', {
      assetTag: `T-${run}`,
      name: 'Festoon over the square',
      typeId: ids.type,
      siteId: ids.site,
      circuitId: ids.circuit,
      geometry: 'line',
      lat: 51.5,
      lng: -0.12,
      line: [
        [-0.121, 51.5],
        [-0.119, 51.5],
      ],
      mountingHeightM: 5.5,
    })
    expect(s.status).toBe(201)
    expect(s.body).toMatchObject({ status: 'lit', mountingHeightM: 5.5, version: 1 })
    expect(s.body.line).toHaveLength(2)
    ids.string = s.body.id
    const one = await request(t.app)
      .get(`/api/v1/strings/${ids.string}`)
      .set('Authorization', await as('crew'))
    expect(one.status).toBe(200)
    expect(one.body).toMatchObject({ version: 1, typeId: ids.type, siteId: ids.site })
    expect(one.body.type.id).toBe(ids.type) // the string page's detail is still there
  })

  it('answers a stale version with 409 edit_conflict and the current row', async () => {
    const url = `/api/v1/clients/${ids.client}`
    const first = await request(t.app)
      .patch(url)
      .set('Authorization', await as('manager'))
      .send({ version: 1, emergencyPhone: '0800 000 111' })
    expect(first.status).toBe(200)
    expect(first.body.version).toBe(2)
    const stale = await request(t.app)
      .patch(url)
      .set('Authorization', await as('admin'))
      .send({ version: 1, tariffPerKwh: 0.5 })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('edit_conflict')
    expect(stale.body.error.details.current).toMatchObject({ version: 2, emergencyPhone: '0800 000 111' })
    expect((await t.db('clients').where({ id: ids.client }).first()).tariffPerKwh).toBe(0.31)
  })

  it('writes an audit row with before and after', async () => {
    const row = await t
      .db('auditLog')
      .where({ entity: 'client', entityId: ids.client, action: 'update' })
      .orderBy('id', 'desc')
      .first()
    const details = typeof row.details === 'string' ? JSON.parse(row.details) : row.details
    expect(details.before.emergencyPhone).toBeNull()
    expect(details.after.emergencyPhone).toBe('0800 000 111')
  })

  it('rolls the change back when its audit row cannot be written', async () => {
    // A request id longer than audit_log.request_id (40) makes the audit insert fail in strict mode.
    const by = { userId: 1, role: 'manager' as const, requestId: 'x'.repeat(300) }
    const def = kindDef('clients')
    await expect(
      updateKind(t.db, def, ids.client, { version: 2, contractRef: 'ROLLBACK' }, by),
    ).rejects.toThrow()
    expect(await t.db('clients').where({ id: ids.client }).first('contractRef', 'version')).toEqual({
      contractRef: null,
      version: 2,
    })
  })

  it('changes a string type with its version and restates its strings; the threshold form stays admin-only', async () => {
    const url = `/api/v1/string-types/${ids.type}`
    const legacy = await request(t.app)
      .patch(url)
      .set('Authorization', await as('manager'))
      .send({ replaceAtRatio: 1.1 })
    expect(legacy.status).toBe(403)
    const res = await request(t.app)
      .patch(url)
      .set('Authorization', await as('manager'))
      .send({
        version: 1,
        lampClasses: [{ label: 'lamp', count: 10, ratedVolts: 23, ratedAmps: 0.1, shunted: true }],
      })
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ version: 2, restated: expect.any(Number) })
    expect(res.body.lampClasses).toHaveLength(1)
    expect(res.body.lampClasses[0].count).toBe(10)
    const listed = await request(t.app)
      .get('/api/v1/string-types')
      .set('Authorization', await as('crew'))
    expect(listed.body.items.find((x: { id: number }) => x.id === ids.type).classes[0].count).toBe(10)
  })

  it('keeps the old answers of shared paths unless the query asks for a page', async () => {
    const auth = await as('manager')
    const map = await request(t.app).get('/api/v1/strings?limit=5').set('Authorization', auth)
    expect(Object.keys(map.body).sort()).toEqual(['items', 'truncated'])
    const crews = await request(t.app).get('/api/v1/crews').set('Authorization', auth)
    expect(crews.body.total).toBeUndefined()
    expect(crews.body.items[0]).toHaveProperty('members')
    const paged = await request(t.app).get('/api/v1/crews?page=1&pageSize=2').set('Authorization', auth)
    expect(paged.body.items.length).toBeLessThanOrEqual(2)
    expect(paged.body.total).toBeGreaterThanOrEqual(paged.body.items.length)
    expect(paged.body.items[0]).toHaveProperty('memberIds')
  })

  it('refuses an invalid time zone with the field', async () => {
    const res = await post('manager', 'clients', { ...client, name: `Zone ${run}`, timeZone: 'Mars/Olympus' })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
    expect(res.body.error.details.fields.map((f: { path: string }) => f.path)).toContain('body.timeZone')
  })

  it('answers a duplicate asset tag with 409 and an unknown site with 400', async () => {
    const base = { name: 'Again', typeId: ids.type, siteId: ids.site, lat: 51.5, lng: -0.12 }
    const dup = await post('manager', 'strings', { ...base, assetTag: `T-${run}` })
    expect(dup.status).toBe(409)
    expect(dup.body.error.code).toBe('duplicate')
    expect(dup.body.error.details.field).toBe('body.assetTag')
    const unknown = await post('manager', 'strings', { ...base, assetTag: `U-${run}`, siteId: 99999999 })
    expect(unknown.status).toBe(400)
    expect(unknown.body.error.code).toBe('unknown_reference')
    expect(unknown.body.error.details.fields[0].path).toBe('body.siteId')
  })

  it('lets crews read only, and supervisors edit crews but not clients', async () => {
    expect((await post('crew', 'clients', { ...client, name: `Crew ${run}` })).status).toBe(403)
    expect(
      (
        await request(t.app)
          .get('/api/v1/clients')
          .set('Authorization', await as('crew'))
      ).status,
    ).toBe(200)
    expect((await post('supervisor', 'clients', { ...client, name: `Sup ${run}` })).status).toBe(403)
    const crew = await post('supervisor', 'crews', {
      name: `Ember ${run}`.slice(0, 80),
      depotName: 'Yard',
      depotLat: 51.5,
      depotLng: -0.12,
      shiftStart: '16:00',
      shiftEnd: '00:30',
    })
    expect(crew.status).toBe(201)
    expect(crew.body.memberIds).toEqual([])
    ids.crew = crew.body.id
  })

  it('archives a string: gone from the map list and the queue, history kept, readable with archived=true', async () => {
    await t.db('strings').where({ id: ids.string }).update({ status: 'dark', dark: true })
    await request(t.app)
      .post('/api/v1/queue/refresh')
      .set('Authorization', await as('supervisor'))
    const open = () =>
      t
        .db('queueItems')
        .where({ stringId: ids.string })
        .whereIn('state', ['open', 'snoozed'])
        .count({ n: '*' })
    expect(Number((await open())[0].n)).toBeGreaterThan(0)
    const del = await request(t.app)
      .delete(`/api/v1/strings/${ids.string}`)
      .set('Authorization', await as('manager'))
    expect(del.status).toBe(200)
    expect(del.body.archivedAt).not.toBeNull()
    expect(Number((await open())[0].n)).toBe(0)
    const map = await request(t.app)
      .get(`/api/v1/strings?q=T-${run}`)
      .set('Authorization', await as('crew'))
    expect(map.body.items).toEqual([])
    expect(await t.db('strings').where({ id: ids.string }).first('id')).toBeDefined()
    const live = await request(t.app)
      .get(`/api/v1/strings?page=1&q=T-${run}`)
      .set('Authorization', await as('manager'))
    expect(live.body).toEqual({ items: [], total: 0 })
    const all = await request(t.app)
      .get(`/api/v1/strings?page=1&q=T-${run}&archived=true`)
      .set('Authorization', await as('manager'))
    expect(all.body.total).toBe(1)
    expect(all.body.items[0].id).toBe(ids.string)
  })

  // Data rule (developers' guide): archive instead of deleting, and leave nothing live under a record
  // no list shows. Common practice, no source: a register keeps every asset under a live parent.
  it('refuses to archive a record live rows still name, and archives it once they are gone', async () => {
    const site = await post('manager', 'sites', {
      clientId: ids.client,
      name: `Yard ${run}`,
      kind: 'street',
      lat: 51.5,
      lng: -0.12,
    })
    expect(site.status).toBe(201)
    const s = await post('manager', 'strings', {
      assetTag: `T-${run}-Y`,
      name: 'Tree wrap in the yard',
      typeId: ids.type,
      siteId: site.body.id,
      geometry: 'point',
      lat: 51.5,
      lng: -0.12,
      mountingHeightM: 3,
    })
    expect(s.status).toBe(201)
    const refused = await request(t.app)
      .delete(`/api/v1/sites/${site.body.id}`)
      .set('Authorization', await as('manager'))
    expect([refused.status, refused.body.error.code]).toEqual([409, 'in_use'])
    expect(refused.body.error.message).toContain('1 live string')
    expect((await t.db('sites').where({ id: site.body.id }).first('archivedAt')).archivedAt).toBeNull()

    await request(t.app)
      .delete(`/api/v1/strings/${s.body.id}`)
      .set('Authorization', await as('manager'))
    const done = await request(t.app)
      .delete(`/api/v1/sites/${site.body.id}`)
      .set('Authorization', await as('manager'))
    expect(done.status).toBe(200)
    expect(done.body.archivedAt).not.toBeNull()
  })
})

describe('crew membership', () => {
  let userId: number
  let token: string
  beforeAll(async () => {
    const hash = (await t.db('users').where({ email: 'crew@example.org' }).first('passwordHash')).passwordHash
    ;[userId] = await t.db('users').insert({
      email: `new.${run.toLowerCase()}@example.org`,
      name: 'New Starter',
      role: 'crew',
      passwordHash: hash,
      active: true,
    })
    const res = await request(t.app)
      .post('/api/v1/auth/sign-in')
      .send({ email: `new.${run.toLowerCase()}@example.org`, password: 'lampwright' })
    token = `Bearer ${res.body.token}`
  })

  it('tells a user without a crew whom to ask', async () => {
    const res = await request(t.app).get('/api/v1/runs/mine').set('Authorization', token)
    expect(res.status).toBe(200)
    expect(res.body).toMatchObject({ run: null, crew: null })
    const supervisors = await t.db('users').where({ role: 'supervisor', active: true }).pluck('name')
    expect(res.body.askFrom.length).toBeGreaterThan(0)
    for (const n of res.body.askFrom) expect(supervisors).toContain(n)
  })

  it('a manager may not move people between crews; a supervisor may, and the member sees the run', async () => {
    const crew = (
      await request(t.app)
        .get(`/api/v1/crews/${ids.crew}`)
        .set('Authorization', await as('manager'))
    ).body
    const byManager = await request(t.app)
      .patch(`/api/v1/crews/${ids.crew}`)
      .set('Authorization', await as('manager'))
      .send({ version: crew.version, memberIds: [userId] })
    expect(byManager.status).toBe(403)
    const res = await request(t.app)
      .patch(`/api/v1/crews/${ids.crew}`)
      .set('Authorization', await as('supervisor'))
      .send({ version: crew.version, memberIds: [userId] })
    expect(res.status).toBe(200)
    expect(res.body.memberIds).toEqual([userId])
    const manager = await t.db('users').where({ role: 'manager' }).first('id')
    const wrong = await request(t.app)
      .patch(`/api/v1/crews/${ids.crew}`)
      .set('Authorization', await as('supervisor'))
      .send({ version: res.body.version, memberIds: [userId, manager.id] })
    expect(wrong.status).toBe(400)
    expect(wrong.body.error.details.fields[0].path).toBe('body.memberIds.1')

    const date = '2031-01-15'
    const item = await t.db('queueItems').where({ state: 'open' }).first('id')
    const pub = await request(t.app)
      .post('/api/v1/runs/publish')
      .set('Authorization', await as('supervisor'))
      .send({ date, runs: [{ crewId: ids.crew, itemIds: [item.id] }] })
    expect(pub.status).toBe(200)
    const mine = await request(t.app).get(`/api/v1/runs/mine?date=${date}`).set('Authorization', token)
    expect(mine.status).toBe(200)
    expect(mine.body.crew).toEqual({ id: ids.crew, name: crew.name })
    expect(mine.body.run.crewId).toBe(ids.crew)
    const published = pub.body.runs.find((r: { crewId: number }) => r.crewId === ids.crew)
    expect(mine.body.run.id).toBe(published.id)
    expect(mine.body.run.stops.length).toBe(published.stops.length)
  })
})
