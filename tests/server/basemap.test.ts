// The basemap the app serves itself (BASEMAP_FILE, PMTiles by range requests) and what GET /config
// tells the client to draw.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { PMTiles, type RangeResponse, type Source } from 'pmtiles'
import { makeTestApp, type TestApp } from './helpers'
import { pmtilesArchive } from '../fixtures/pmtiles-archive'

const TILE = Buffer.from('a tile of the town, byte for byte')
const { archive, tileOffset } = pmtilesArchive(TILE)
const dir = mkdtempSync(join(tmpdir(), 'lw-basemap-'))
const file = join(dir, 'town.pmtiles')
writeFileSync(file, archive)

type Parser = Parameters<request.Test['parse']>[0]
const binary: Parser = (res, done) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => done(null, Buffer.concat(chunks)))
}
const range = (t: TestApp, from: number, to: number) =>
  request(t.app).get('/basemap.pmtiles').set('Range', `bytes=${from}-${to}`).buffer(true).parse(binary)

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp({ BASEMAP_FILE: file, TILE_URL: '' })
})
afterAll(async () => {
  await t.close()
  rmSync(dir, { recursive: true, force: true })
})

describe('GET /basemap.pmtiles with BASEMAP_FILE set', () => {
  it('answers a range request with 206 and exactly those bytes', async () => {
    const res = await range(t, 0, 7)
    expect(res.status).toBe(206)
    expect(res.headers['content-range']).toBe(`bytes 0-7/${archive.length}`)
    // "PMTiles" then version 3 (PMTiles v3 spec, header bytes 0–7).
    expect(res.body).toEqual(Buffer.from([...Buffer.from('PMTiles'), 3]))
    const tile = await range(t, tileOffset, tileOffset + TILE.length - 1)
    expect(tile.status).toBe(206)
    expect(tile.body.toString()).toBe(TILE.toString())
  })
  it('is cacheable, untransformed and says it takes ranges', async () => {
    const res = await request(t.app).get('/basemap.pmtiles').buffer(true).parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers['accept-ranges']).toBe('bytes')
    expect(res.headers['cache-control']).toContain('public')
    expect(res.headers['cache-control']).toContain('no-transform')
    expect(res.headers.etag).toBeTruthy()
    expect(res.body.length).toBe(archive.length)
  })
  it('refuses a range past the end with 416', async () => {
    const res = await range(t, archive.length + 10, archive.length + 20)
    expect(res.status).toBe(416)
    expect(res.headers['content-range']).toBe(`bytes */${archive.length}`)
  })
  it('reads as a PMTiles archive: the pmtiles reader gets the tile back through range requests', async () => {
    const source: Source = {
      getKey: () => '/basemap.pmtiles',
      async getBytes(offset, length): Promise<RangeResponse> {
        const res = await range(t, offset, offset + length - 1)
        const b = res.body as Buffer
        return { data: b.buffer.slice(b.byteOffset, b.byteOffset + b.length) as ArrayBuffer }
      },
    }
    const p = new PMTiles(source)
    const header = await p.getHeader()
    expect(header.specVersion).toBe(3)
    const got = await p.getZxy(0, 0, 0)
    expect(Buffer.from(got!.data).toString()).toBe(TILE.toString())
  })
  it('tells the client to draw the archive, with the app zone and locale', async () => {
    const res = await request(t.app).get('/api/v1/config')
    expect(res.status).toBe(200)
    expect(res.body.basemap).toEqual({ kind: 'pmtiles', url: '/basemap.pmtiles' })
    expect(res.body.timeZone).toBe('Europe/London')
    expect(res.body.locale).toBe('en-GB')
    const system = await request(t.app)
      .get('/api/v1/settings/system')
      .set('Authorization', `Bearer ${await t.token('admin')}`)
    expect(system.body.tiles).toEqual({ source: 'basemap_file', url: file })
  })
})

describe('other basemap settings', () => {
  it('answers 404 basemap_missing when the file is gone', async () => {
    const gone = await makeTestApp({ BASEMAP_FILE: join(dir, 'nothing.pmtiles') })
    try {
      const res = await request(gone.app).get('/basemap.pmtiles')
      expect(res.status).toBe(404)
      expect(res.body.error.code).toBe('basemap_missing')
    } finally {
      await gone.close()
    }
  })
  it('uses TILE_URL when set, and none outside demo mode without either', async () => {
    const tiles = await makeTestApp({
      TILE_URL: 'https://tiles.example.org/{z}/{x}/{y}.png',
      BASEMAP_FILE: '',
    })
    const none = await makeTestApp({ TILE_URL: '', BASEMAP_FILE: '', DEMO_MODE: 'false' })
    try {
      expect((await request(tiles.app).get('/api/v1/config')).body.basemap).toEqual({
        kind: 'tile_server',
        url: 'https://tiles.example.org/{z}/{x}/{y}.png',
      })
      expect((await request(none.app).get('/api/v1/config')).body.basemap).toEqual({
        kind: 'none',
        url: null,
      })
    } finally {
      await tiles.close()
      await none.close()
    }
  })
  it('refuses an unknown APP_TIME_ZONE at start-up', async () => {
    await expect(makeTestApp({ APP_TIME_ZONE: 'Mars/Olympus' })).rejects.toThrow(/APP_TIME_ZONE/)
  })
})
