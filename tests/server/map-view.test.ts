// The map's compact answer (issue 13 part 7): every string in the box is accounted for, drawn alone
// or counted in a group; alone from zoom 15 on with what the map draws (tag, name, state, line).
// Expected counts come from counting the demo town's rows directly, not from the code under test.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let crew: string
let box: [number, number, number, number]
let inBox: { id: number; line: unknown }[]
beforeAll(async () => {
  t = await makeTestApp()
  crew = `Bearer ${await t.token('crew')}`
  const b = await t
    .db('strings')
    .whereNull('archivedAt')
    .first(
      t.db.raw('min(lng) as w'),
      t.db.raw('min(lat) as s'),
      t.db.raw('max(lng) as e'),
      t.db.raw('max(lat) as n'),
    )
  box = [b.w - 0.001, b.s - 0.001, b.e + 0.001, b.n + 0.001]
  inBox = await t.db('strings').whereNull('archivedAt').select('id', 'line')
})
afterAll(() => t.close())

const view = (bbox: number[], zoom: number) =>
  request(t.app)
    .get(`/api/v1/strings/map?bbox=${bbox.join(',')}&zoom=${zoom}`)
    .set('Authorization', crew)

describe('GET /strings/map', () => {
  it('groups the whole town at district zoom and still accounts for every string', async () => {
    const res = await view(box, 12)
    expect(res.status).toBe(200)
    const alone = res.body.items.length
    const grouped = res.body.clusters.reduce((a: number, c: number[]) => a + c[2], 0)
    expect(res.body.total).toBe(inBox.length)
    expect(alone + grouped).toBe(inBox.length)
    expect(res.body.clusters.length).toBeGreaterThan(0)
    // Far fewer marks than strings: that is the point of grouping.
    expect(alone + res.body.clusters.length).toBeLessThan(inBox.length / 4)
    for (const [lat, lng] of res.body.clusters) {
      expect(lat).toBeGreaterThanOrEqual(box[1])
      expect(lat).toBeLessThanOrEqual(box[3])
      expect(lng).toBeGreaterThanOrEqual(box[0])
      expect(lng).toBeLessThanOrEqual(box[2])
    }
    // A group's worst state is the worst of the town's (dark, index 4, when any string is dark).
    const dark = await t.db('strings').whereNull('archivedAt').where({ status: 'dark' }).first('id')
    if (dark) expect(Math.max(...res.body.clusters.map((c: number[]) => c[3]))).toBe(4)
  })

  it('sends every string alone at street zoom, with its tag, name and line', async () => {
    const res = await view(box, 17)
    expect(res.body.clusters).toEqual([])
    expect(res.body.items.map((i: unknown[]) => i[0]).sort((a: number, b: number) => a - b)).toEqual(
      inBox.map((s) => s.id).sort((a, b) => a - b),
    )
    const lined = inBox.filter((s) => s.line != null).length
    expect(res.body.lines).toHaveLength(lined)
    const one = await t
      .db('strings')
      .whereNull('archivedAt')
      .orderBy('id')
      .first('id', 'assetTag', 'name', 'status')
    const item = res.body.items.find((i: unknown[]) => i[0] === one.id)
    expect(item[6]).toBe(one.assetTag)
    expect(item[7]).toBe(one.name)
    expect(['lit', 'watch', 'safe', 'replace', 'dark'][item[3]]).toBe(one.status)
  })

  it('answers a small box with only the strings in it', async () => {
    const s = await t.db('strings').whereNull('archivedAt').orderBy('id').first('lat', 'lng')
    const small = [s.lng - 0.0005, s.lat - 0.0005, s.lng + 0.0005, s.lat + 0.0005]
    const n = await t
      .db('strings')
      .whereNull('archivedAt')
      .whereBetween('lat', [small[1], small[3]])
      .whereBetween('lng', [small[0], small[2]])
      .count({ n: '*' })
    for (const zoom of [11, 18]) {
      const res = await view(small, zoom)
      const grouped = res.body.clusters.reduce((a: number, c: number[]) => a + c[2], 0)
      expect(res.body.items.length + grouped).toBe(Number(n[0].n))
    }
  })

  it('refuses a request without a zoom', async () => {
    const res = await request(t.app)
      .get(`/api/v1/strings/map?bbox=${box.join(',')}`)
      .set('Authorization', crew)
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('validation_failed')
  })
})
