// Each process's copy of the strings' places and states for the zoomed-out map (map-positions.ts):
// after the first full read it reads only the rows changed since, and still learns of a new string, a
// changed state and an archived string; every POSITIONS_FULL_MS it reads everything again. The test's
// strings sit far from the demo town so that other tests' counts of the town are untouched.
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest'
import { makeTestApp, type TestApp } from './helpers'
import {
  POSITIONS_FULL_MS,
  POSITIONS_TTL_MS,
  positions,
  type Positions,
} from '../../server/services/map-positions'
import { URGENCY_ORDER } from '../../shared/vocab/map-view'

let t: TestApp
const ids: number[] = []
let base: { typeId: number; siteId: number }
const sql: string[] = []

const place = (p: Positions, id: number) => {
  for (let i = 0; i < p.size; i++)
    if (p.ids[i] === id) return Number.isNaN(p.lat[i]) ? 'gone' : { lat: p.lat[i], u: p.u[i] }
  return undefined
}

async function addString(n: number, status = 'lit') {
  const [id] = await t.db('strings').insert({
    ...base,
    assetTag: `MAPPOS-${n}`,
    name: `Map copy test ${n}`,
    lat: 10 + n / 1000,
    lng: 10 + n / 1000,
    status,
  })
  ids.push(id)
  return id as number
}

beforeAll(async () => {
  t = await makeTestApp()
  base = await t.db('strings').whereNull('archivedAt').orderBy('id').first('typeId', 'siteId')
  t.db.on('query', (q: { sql: string }) => sql.push(q.sql))
})
afterAll(async () => {
  vi.useRealTimers()
  await t.db('strings').whereIn('id', ids).delete()
  await t.close()
})

describe('the map copy of string places', () => {
  it('learns of new, changed and archived strings from the changed rows only', async () => {
    const changed = await addString(1)
    const archived = await addString(2)
    vi.useFakeTimers({ toFake: ['Date'] })
    const first = await positions(t.db)
    expect(place(first, changed)).toEqual({ lat: 10.001, u: URGENCY_ORDER.indexOf('lit') })
    expect(place(first, archived)).toMatchObject({ lat: 10.002 })

    await t.db('strings').where({ id: changed }).update({ status: 'dark', dark: true })
    await t.db('strings').where({ id: archived }).update({ archivedAt: new Date() })
    const added = await addString(3, 'replace')
    // Within the TTL nothing is read again.
    sql.length = 0
    await positions(t.db)
    expect(sql).toEqual([])

    vi.setSystemTime(Date.now() + POSITIONS_TTL_MS + 1)
    const second = await positions(t.db)
    expect(sql).toHaveLength(1)
    expect(sql[0]).toMatch(/where `s`.`updated_at` >= \?$/)
    expect(place(second, changed)).toEqual({ lat: 10.001, u: URGENCY_ORDER.indexOf('dark') })
    expect(place(second, archived)).toBe('gone')
    expect(place(second, added)).toEqual({ lat: 10.003, u: URGENCY_ORDER.indexOf('replace') })

    vi.setSystemTime(Date.now() + POSITIONS_FULL_MS + 1)
    sql.length = 0
    const full = await positions(t.db)
    expect(sql[0]).toMatch(/where `s`.`archived_at` is null$/)
    expect(place(full, archived)).toBeUndefined()
    expect(place(full, added)).toEqual({ lat: 10.003, u: URGENCY_ORDER.indexOf('replace') })
    const live = await t.db('strings').whereNull('archivedAt').count({ n: '*' })
    expect(full.size).toBe(Number(live[0].n))
  })
})
