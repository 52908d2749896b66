// The client's pages take their role lists from shared/roles.ts, as the server's routes do; a few
// pages' access as it stood before the lists were named (issue 9 item 6).
import { describe, expect, it } from 'vitest'
import type { RouteRecordRaw } from 'vue-router'
import { routes } from '../../src/router/routes'

function byName(list: RouteRecordRaw[], name: string): RouteRecordRaw | undefined {
  for (const r of list) {
    if (r.name === name) return r
    const inner = r.children && byName(r.children, name)
    if (inner) return inner
  }
  return undefined
}

const rolesOf = (name: string) => [...(byName(routes, name)?.meta?.roles ?? [])].sort()

describe('who may open which page', () => {
  it.each([
    ['run', ['crew']],
    ['map', ['crew', 'manager', 'supervisor']],
    ['log-visit', ['crew', 'supervisor']],
    ['queue', ['supervisor']],
    ['reports', ['manager']],
    ['certificates', ['safety']],
    ['users', ['admin']],
    ['mail', ['admin']],
    ['string', ['admin', 'crew', 'manager', 'safety', 'supervisor']],
  ])('%s is open to %j', (name, roles) => {
    expect(rolesOf(name)).toEqual(roles)
  })

  it('marks the public fault report as public, with no roles', () => {
    const report = byName(routes, 'report')
    expect(report?.meta?.public).toBe(true)
    expect(report?.meta?.roles).toBeUndefined()
  })
})
