import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import exifr from 'exifr'
import { imageSize } from 'image-size'
import { randomBytes } from 'node:crypto'
import { mkdtemp, readFile, readdir, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { makeTestApp, type TestApp } from './helpers'
import { exifTime } from '../../server/services/photos/exif'
import { jpeg, png, pngDeclaring, webp, type ExifFixture } from '../fixtures/photos/build'
import type { Db } from '../../server/db'
import { localFileStore } from '../../server/files/local-store'

let t: TestApp
let dir: string
let visitId: number
const created: number[] = []

beforeAll(async () => {
  t = await makeTestApp()
  dir = await mkdtemp(join(tmpdir(), 'lampwright-photos-'))
  t.deps.files = localFileStore(dir)
  // A visit written by the demo crew account itself, so that account is its author.
  const crewUser = await t.db('users').where({ email: 'crew@example.org' }).first('id', 'crewId')
  visitId = (await t.db('visits').where({ userId: crewUser.id }).first('id')).id
})
afterAll(async () => {
  if (created.length) await t.db('photos').whereIn('id', created).delete()
  await rm(dir, { recursive: true, force: true })
  await t.close()
})

const bearer = async (role: 'crew' | 'supervisor' | 'manager' = 'crew') => `Bearer ${await t.token(role)}`
const files = () => readdir(dir)
const upload = async (parts: [Buffer, string, string][], id = visitId, app = t.app) => {
  let req = request(app)
    .post(`/api/v1/visits/${id}/photos`)
    .set('Authorization', await bearer())
  for (const [buf, filename, contentType] of parts) req = req.attach('photo', buf, { filename, contentType })
  const res = await req
  if (res.status === 201) created.push(...res.body.items.map((i: { id: number }) => i.id))
  return res
}

// The fixture below is built by tests/fixtures/photos/build.ts: these are the values written into its EXIF.
const fixtureExif: ExifFixture = {
  dateTimeOriginal: '2025:12:06 17:45:30',
  offsetTimeOriginal: '+01:00',
  lat: { ref: 'N', dms: [51, 30, 26.46] },
  lng: { ref: 'W', dms: [0, 7, 39.93] },
  orientation: 6,
}

describe('uploading visit photos', () => {
  it('accepts a JPEG, a PNG and a WebP in one request, re-encodes each to JPEG and stores two files each', async () => {
    const before = (await files()).length
    const res = await upload([
      [await jpeg(), 'a.jpg', 'image/jpeg'],
      [await png(), 'b.png', 'image/png'],
      [await webp(), 'c.webp', 'image/webp'],
    ])
    expect(res.status).toBe(201)
    expect(res.body.items).toHaveLength(3)
    for (const item of res.body.items) {
      expect(item).toMatchObject({ width: 64, height: 48, takenAt: null, lat: null, lng: null })
      expect(item.url).toBe(`/api/v1/photos/${item.id}/file`)
      expect(item.thumbUrl).toBe(`/api/v1/photos/${item.id}/thumb`)
    }
    expect((await files()).length).toBe(before + 6)
    const rows = await t.db('photos').whereIn(
      'id',
      res.body.items.map((i: { id: number }) => i.id),
    )
    expect(
      rows.every(
        (r) => r.mime === 'image/jpeg' && r.visitId === visitId && /^[0-9a-f-]{36}\.jpg$/.test(r.fileName),
      ),
    ).toBe(true)
    const listed = await request(t.app)
      .get(`/api/v1/visits/${visitId}/photos`)
      .set('Authorization', await bearer('manager'))
    expect(listed.body.items.map((i: { id: number }) => i.id)).toEqual(
      expect.arrayContaining(rows.map((r) => r.id)),
    )
    // The string page's history shows them under their visit, in the order they were stored.
    const { stringId } = await t.db('visits').where({ id: visitId }).first('stringId')
    const page = await request(t.app)
      .get(`/api/v1/strings/${stringId}`)
      .set('Authorization', await bearer('manager'))
    const shown = page.body.visits.find((v: { id: number }) => v.id === visitId)
    expect(shown.photos.map((p: { id: number }) => p.id)).toEqual(
      expect.arrayContaining(rows.map((r) => r.id).sort((a, b) => a - b)),
    )
    expect(shown.photos[0].thumbUrl).toBe(`/api/v1/photos/${shown.photos[0].id}/thumb`)
  })

  it('reads capture time and GPS from EXIF, turns the image upright, and stores it with no EXIF left', async () => {
    const res = await upload([[await jpeg(64, 48, fixtureExif), 'exif.jpg', 'image/jpeg']])
    expect(res.status).toBe(201)
    const item = res.body.items[0]
    // 17:45:30 at +01:00 is 16:45:30 UTC (the offset tag: Exif 2.31, CIPA DC-008-2016).
    expect(item.takenAt).toBe('2025-12-06T16:45:30.000Z')
    // Degrees + minutes/60 + seconds/3600, negative for S and W (Exif 2.32 §4.6.6 GPS tags), to 6 places.
    expect(item.lat).toBeCloseTo(51 + 30 / 60 + 26.46 / 3600, 6)
    expect(item.lng).toBeCloseTo(-(7 / 60 + 39.93 / 3600), 6)
    // Orientation 6 means the stored rows must be turned 90° clockwise (Exif 2.32 §4.6.4 A, Orientation).
    expect([item.width, item.height]).toEqual([48, 64])
    const row = await t.db('photos').where({ id: item.id }).first()
    const stored = await readFile(join(dir, row.fileName))
    // No TIFF/EXIF/GPS blocks at all (the JFIF header jimp writes carries no capture data).
    expect(
      await exifr.parse(stored, { tiff: true, exif: true, gps: true, xmp: true, iptc: true }),
    ).toBeUndefined()
    expect(stored.includes(Buffer.from('Exif\0\0', 'latin1'))).toBe(false)
    expect(imageSize(stored)).toMatchObject({ width: 48, height: 64, type: 'jpg' })
  })

  it('reads an EXIF time without an offset as the wall-clock time in UTC, and ignores an unset clock', () => {
    expect(exifTime('2025:12:06 17:45:30', undefined)?.toISOString()).toBe('2025-12-06T17:45:30.000Z')
    expect(exifTime('0000:00:00 00:00:00', undefined)).toBeNull()
  })

  it('shrinks the longest side to 2048 and the thumbnail to 320, keeping the aspect ratio', async () => {
    const res = await upload([[await png(2400, 1200), 'wide.png', 'image/png']])
    expect(res.status).toBe(201)
    // 2400×1200 is 2:1, so 2048×1024 and 320×160 (limits from the brief: 2048 full, 320 thumbnail).
    expect(res.body.items[0]).toMatchObject({ width: 2048, height: 1024 })
    const row = await t.db('photos').where({ id: res.body.items[0].id }).first()
    expect(imageSize(await readFile(join(dir, row.thumbName)))).toMatchObject({ width: 320, height: 160 })
  })

  it('answers a text file named .jpg with 415 unsupported_type and writes nothing', async () => {
    const before = await files()
    const res = await upload([
      [Buffer.from('these are not the pixels you are looking for\n'), 'fake.jpg', 'image/jpeg'],
    ])
    expect(res.status).toBe(415)
    expect(res.body.error.code).toBe('unsupported_type')
    expect(await files()).toEqual(before)
  })

  it('stores all photos of a request or none: one bad file rejects the good one too', async () => {
    const before = await files()
    const count = await t.db('photos').where({ visitId }).count({ n: '*' })
    const res = await upload([
      [await jpeg(), 'good.jpg', 'image/jpeg'],
      [Buffer.from('plain text'), 'bad.png', 'image/png'],
    ])
    expect(res.status).toBe(415)
    expect(await files()).toEqual(before)
    expect(await t.db('photos').where({ visitId }).count({ n: '*' })).toEqual(count)
  })

  it('removes the files it wrote when the database insert fails', async () => {
    const before = await files()
    const real = t.deps.db
    const failing = Object.assign((table: string) => real(table), {
      transaction: async () => {
        throw new Error('simulated database failure')
      },
    })
    t.deps.db = failing as unknown as Db
    try {
      const res = await upload([[await jpeg(), 'ok.jpg', 'image/jpeg']])
      expect(res.status).toBe(500)
    } finally {
      t.deps.db = real
    }
    expect(await files()).toEqual(before)
  })

  it('answers empty, missing, too many and misnamed files with 400 and their codes', async () => {
    const empty = await upload([[Buffer.alloc(0), 'empty.jpg', 'image/jpeg']])
    expect([empty.status, empty.body.error.code]).toEqual([400, 'empty_file'])
    const none = await request(t.app)
      .post(`/api/v1/visits/${visitId}/photos`)
      .set('Authorization', await bearer())
      .field('note', 'x')
    expect([none.status, none.body.error.code]).toEqual([400, 'no_photo'])
    const small = await jpeg(8, 8)
    const nine = await upload(
      Array.from({ length: 9 }, (_, i) => [small, `${i}.jpg`, 'image/jpeg'] as [Buffer, string, string]),
    )
    expect([nine.status, nine.body.error.code]).toEqual([400, 'too_many_files'])
    const misnamed = await request(t.app)
      .post(`/api/v1/visits/${visitId}/photos`)
      .set('Authorization', await bearer())
      .attach('picture', small, { filename: 'a.jpg', contentType: 'image/jpeg' })
    expect([misnamed.status, misnamed.body.error.code]).toEqual([400, 'unexpected_field'])
  })

  it('returns the photos already stored when the same upload key comes again, storing nothing twice', async () => {
    const key = `photo-${Date.now()}`
    const send = async () =>
      request(t.app)
        .post(`/api/v1/visits/${visitId}/photos`)
        .set('Authorization', await bearer())
        .set('Idempotency-Key', key)
        .attach('photo', await jpeg(16, 12), { filename: 'a.jpg', contentType: 'image/jpeg' })
    const first = await send()
    expect(first.status).toBe(201)
    created.push(...first.body.items.map((i: { id: number }) => i.id))
    const before = (await files()).length
    const again = await send()
    expect(again.status).toBe(200)
    expect(again.body.items.map((i: { id: number }) => i.id)).toEqual(
      first.body.items.map((i: { id: number }) => i.id),
    )
    expect((await files()).length).toBe(before)
  })

  it('rejects a tiny PNG that declares 20000×20000 before decoding it, with 400 image_dimensions', async () => {
    const bomb = await pngDeclaring(20000, 20000)
    expect(bomb.length).toBeLessThan(200)
    const res = await upload([[bomb, 'bomb.png', 'image/png']])
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('image_dimensions')
    expect(res.body.error.details).toMatchObject({ width: 20000, height: 20000 })
  })

  it('answers an unknown visit with 404 and a manager (not a field role) with 403', async () => {
    const unknown = await upload([[await jpeg(), 'a.jpg', 'image/jpeg']], 2_000_000_000)
    expect([unknown.status, unknown.body.error.code]).toEqual([404, 'not_found'])
    const manager = await request(t.app)
      .post(`/api/v1/visits/${visitId}/photos`)
      .set('Authorization', await bearer('manager'))
      .attach('photo', await jpeg(), { filename: 'a.jpg', contentType: 'image/jpeg' })
    expect(manager.status).toBe(403)
  })

  // Who may add photos to a visit's record: its author, the author's crew, or a supervisor
  // (the rule of this product, issue 8; common practice, no source).
  it("refuses a crew member of another crew with 403 forbidden and stores nothing, and lets the author's crewmate and a supervisor add photos", async () => {
    const signIn = async (email: string) => {
      const res = await request(t.app).post('/api/v1/auth/sign-in').send({ email, password: 'lampwright' })
      expect(res.status).toBe(200)
      return `Bearer ${res.body.token}`
    }
    const post = async (auth: string) => {
      const res = await request(t.app)
        .post(`/api/v1/visits/${visitId}/photos`)
        .set('Authorization', auth)
        .attach('photo', await jpeg(), { filename: 'a.jpg', contentType: 'image/jpeg' })
      if (res.status === 201) created.push(...res.body.items.map((i: { id: number }) => i.id))
      return res
    }
    const before = await t.db('photos').where({ visitId }).count({ n: '*' })
    // Priya is in crew Tallow; the demo crew account is in crew Lantern (seeds/demo/people.ts).
    const stranger = await post(await signIn('priya.castellane@example.org'))
    expect([stranger.status, stranger.body.error?.code]).toEqual([403, 'forbidden'])
    expect(await t.db('photos').where({ visitId }).count({ n: '*' })).toEqual(before)
    // Dewi is the demo crew account's crewmate in Lantern.
    expect((await post(await signIn('dewi.marchbank@example.org'))).status).toBe(201)
    expect((await post(await bearer('supervisor'))).status).toBe(201)
  })
})

describe('upload size limit', () => {
  let small: TestApp
  beforeAll(async () => {
    small = await makeTestApp({ UPLOAD_MAX_MB: '0.01' })
    small.deps.files = localFileStore(dir)
  })
  afterAll(() => small.close())

  it('answers a file over UPLOAD_MAX_MB with 413 too_large and writes nothing', async () => {
    const before = await files()
    // A real JPEG followed by noise: over 0.01 MB (10 485 bytes), and multer counts bytes, not pixels.
    const big = Buffer.concat([await jpeg(), randomBytes(20_000)])
    expect(big.length).toBeGreaterThan(0.01 * 1024 * 1024)
    const res = await upload([[big, 'big.png', 'image/png']], visitId, small.app)
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('too_large')
    expect(res.body.error.message).toMatch(/0\.01 MB/)
    expect(await files()).toEqual(before)
  })
})

describe('serving photos', () => {
  it('serves file and thumbnail only to signed-in users, as private-cached JPEG', async () => {
    const res = await upload([[await jpeg(), 'a.jpg', 'image/jpeg']])
    const { url, thumbUrl } = res.body.items[0]
    expect((await request(t.app).get(url)).status).toBe(401)
    for (const path of [url, thumbUrl]) {
      const got = await request(t.app)
        .get(path)
        .set('Authorization', await bearer('manager'))
        .buffer(true)
      expect(got.status).toBe(200)
      expect(got.headers['content-type']).toMatch(/^image\/jpeg/)
      expect(got.headers['cache-control']).toBe('private, max-age=86400')
      expect(imageSize(got.body)).toMatchObject({ type: 'jpg' })
    }
    const missing = await request(t.app)
      .get('/api/v1/photos/2000000000/file')
      .set('Authorization', await bearer())
    expect([missing.status, missing.body.error.code]).toEqual([404, 'not_found'])
  })
})
