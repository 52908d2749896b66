// The reporter's words reach the work (issue 12 part 2): a report's one photo (checked by its bytes like
// field photos, shown only to signed-in staff), the description and place on the queue item and the
// crew's run stop, hazard reports ranked above every routine item, and the crew's emergency log.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { mkdtemp, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { makeTestApp, type TestApp } from './helpers'
import { from, quietString, report, wholeQueue } from './report-work-helpers'
import { localFileStore } from '../../server/files/local-store'
import { png } from '../fixtures/photos/build'

let t: TestApp
let dir: string
beforeAll(async () => {
  t = await makeTestApp({ TRUST_PROXY: 'loopback' })
  dir = await mkdtemp(join(tmpdir(), 'lampwright-report-work-'))
  t.deps.files = localFileStore(dir)
})
afterAll(async () => {
  await rm(dir, { recursive: true, force: true })
  await t.close()
})

const bearer = async (role: 'crew' | 'supervisor') => `Bearer ${await t.token(role)}`

const sendPhoto = (ref: string, photoKey: string, bytes: Buffer, filename = 'p.png') =>
  request(t.app)
    .post(`/api/v1/reports/${ref}/photo`)
    .set(from())
    .field('photoKey', photoKey)
    .attach('photo', bytes, { filename, contentType: 'image/png' })

describe('a report’s photo', () => {
  it('takes one photo checked by its bytes, shows it to staff only and never on the status page', async () => {
    const s = await quietString(t)
    const r = await report(t, {
      tag: s.assetTag,
      description: 'Cable hanging low over the path.',
      landmark: 'By the bandstand',
    })
    expect(r.photoKey.length).toBeGreaterThanOrEqual(20)
    // A text file named .png: file-type finds no image signature, so the field photos' 415 code.
    const fake = await sendPhoto(r.ref, r.photoKey, Buffer.from('not really a picture at all'))
    expect(fake.status).toBe(415)
    expect(fake.body.error.code).toBe('unsupported_type')
    // A key of no report: 404, the same as an unknown reference.
    const wrongKey = await sendPhoto(r.ref, 'x'.repeat(32), await png())
    expect(wrongKey.status).toBe(404)
    const ok = await sendPhoto(r.ref, r.photoKey, await png())
    expect(ok.status).toBe(201)
    expect(ok.body).toEqual({ ref: r.ref, photo: true })
    // One photo a report: a second send answers 200 and stores nothing more.
    const again = await sendPhoto(r.ref, r.photoKey, await png())
    expect(again.status).toBe(200)
    expect(await t.db('reportPhotos').where({ reportId: r.id }).count({ n: '*' })).toEqual([{ n: 1 }])
    const photo = await t.db('reportPhotos').where({ reportId: r.id }).first('id')
    expect((await request(t.app).get(`/api/v1/report-photos/${photo.id}/thumb`)).status).toBe(401)
    const thumb = await request(t.app)
      .get(`/api/v1/report-photos/${photo.id}/thumb`)
      .set('Authorization', await bearer('crew'))
    expect(thumb.status).toBe(200)
    expect(thumb.headers['content-type']).toBe('image/jpeg')
    const status = await request(t.app).get(`/api/v1/reports/${r.ref}`)
    expect(JSON.stringify(status.body)).not.toMatch(/photo/i)
  })
})

describe('the reporter’s words on the work', () => {
  it('puts the description, the place and the photo on the queue item and the crew’s run stop, nothing personal', async () => {
    const s = await quietString(t)
    const r = await report(t, {
      tag: s.assetTag,
      description: 'Half the lamps flicker and one buzzes.',
      landmark: 'Opposite the library steps',
      name: 'Sam Passer-by',
      email: 'sam.passerby@example.org',
    })
    await sendPhoto(r.ref, r.photoKey, await png())
    const sup = await bearer('supervisor')
    const item = (await wholeQueue(t, sup, '&kind=public_report')).find((i) => i.id === r.queueItemId)!
    expect(item.reports).toHaveLength(1)
    expect(item.reports[0]).toMatchObject({
      ref: r.ref,
      description: 'Half the lamps flicker and one buzzes.',
      near: 'Opposite the library steps',
      hazard: false,
    })
    expect(item.reports[0].photo.thumbUrl).toMatch(/^\/api\/v1\/report-photos\/\d+\/thumb$/)
    const crew = await t.db('users').where({ email: 'crew@example.org' }).first('crewId')
    // A date no other test plans, so this run is ours alone.
    const date = '2027-01-13'
    const pub = await request(t.app)
      .post('/api/v1/runs/publish')
      .set('Authorization', sup)
      .send({ date, runs: [{ crewId: crew.crewId, itemIds: [r.queueItemId] }] })
    expect(pub.status).toBe(200)
    const mine = await request(t.app)
      .get(`/api/v1/runs/mine?date=${date}`)
      .set('Authorization', await bearer('crew'))
    const stop = mine.body.run.stops.find((x: { itemId: number }) => x.itemId === r.queueItemId)
    expect(stop.reports[0]).toMatchObject({
      description: 'Half the lamps flicker and one buzzes.',
      near: 'Opposite the library steps',
    })
    expect(stop.emergency).toBe(false)
    for (const seen of [JSON.stringify(item), JSON.stringify(mine.body)])
      for (const personal of ['Sam Passer-by', 'sam.passerby@example.org'])
        expect(seen).not.toContain(personal)
    const notes = await request(t.app)
      .get(`/api/v1/strings/${s.id}/work-notes`)
      .set('Authorization', await bearer('crew'))
    expect(notes.body.reports.map((n: { ref: string }) => n.ref)).toContain(r.ref)
  })
})
