// A few permissions as they stood before the route rows took named role groups from shared/roles.ts
// (issue 9 item 6: each route keeps its permission); checked in the OpenAPI document and by calling.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'
import type { Role } from '../../shared/roles'

let t: TestApp
let doc: { paths: Record<string, Record<string, { 'x-roles': string[] }>> }
beforeAll(async () => {
  t = await makeTestApp()
  doc = (await request(t.app).get('/api/v1/openapi.json')).body
})
afterAll(() => t.close())

const xRoles = (method: string, path: string) => [...doc.paths[`/api/v1${path}`][method]['x-roles']].sort()

describe('who may call what', () => {
  it.each([
    ['get', '/queue', ['admin', 'manager', 'safety', 'supervisor']],
    ['post', '/queue/{id}/close', ['admin', 'manager', 'supervisor']],
    ['get', '/overdue', ['admin', 'manager', 'supervisor']],
    ['post', '/visits', ['crew', 'supervisor']],
    ['get', '/runs/mine', ['crew', 'supervisor']],
    ['get', '/certificates', ['admin', 'manager', 'safety', 'supervisor']],
    ['get', '/isolations', ['admin', 'manager', 'safety', 'supervisor']],
    ['post', '/certificates', ['admin', 'safety']],
    ['post', '/isolations/{id}/review', ['admin', 'safety']],
    ['get', '/client-report', ['admin', 'manager']],
    ['post', '/users', ['admin']],
    ['post', '/engine/assess', ['admin', 'crew', 'manager', 'safety', 'supervisor']],
    ['post', '/reports', ['public']],
  ])('%s %s is open to %j', (method, path, roles) => {
    expect(xRoles(method, path)).toEqual(roles)
  })

  const call = async (role: Role, path: string) =>
    (
      await request(t.app)
        .get(`/api/v1${path}`)
        .set('Authorization', `Bearer ${await t.token(role)}`)
    ).status

  it('answers the roles outside a group with 403 and those inside with 200', async () => {
    expect(await call('crew', '/queue')).toBe(403)
    expect(await call('safety', '/queue')).toBe(200)
    expect(await call('supervisor', '/queue')).toBe(200)
    expect(await call('safety', '/certificates')).toBe(200)
    expect(await call('crew', '/certificates')).toBe(403)
    const clientId = (await t.db('clients').first('id')).id
    expect(await call('manager', `/client-report?clientId=${clientId}`)).toBe(200)
    expect(await call('supervisor', `/client-report?clientId=${clientId}`)).toBe(403)
    expect(await call('manager', '/runs/mine')).toBe(403)
    expect(await call('supervisor', '/users')).toBe(403)
    expect(await call('admin', '/users')).toBe(200)
  })
})
