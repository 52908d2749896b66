// A certificate's document (issue 12 part 3): a PDF, JPEG or PNG checked by its bytes, stored in the
// file store, shown on the certificate and served only to office staff.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let safety: string
let certificateId: number

/**
 * A minimal one-page PDF built by hand to the PDF 1.4 structure (ISO 32000-1 §7.5: header, body
 * objects, cross-reference table with 10-digit byte offsets, trailer, startxref, %%EOF).
 */
function minimalPdf(): Buffer {
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 200 200] >>',
  ]
  let out = '%PDF-1.4\n'
  const offsets: number[] = []
  objects.forEach((o, i) => {
    offsets.push(Buffer.byteLength(out))
    out += `${i + 1} 0 obj\n${o}\nendobj\n`
  })
  const xref = Buffer.byteLength(out)
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`
  out += offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('')
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`
  return Buffer.from(out, 'latin1')
}

beforeAll(async () => {
  t = await makeTestApp()
  safety = `Bearer ${await t.token('safety')}`
  const platform = await t.db('platforms').orderBy('id').first('id')
  ;[certificateId] = await t.db('certificates').insert({
    kind: 'platform_pre_use',
    subjectType: 'platform',
    subjectId: platform.id,
    doneOn: '2026-12-01',
    result: 'pass',
  })
})
afterAll(async () => {
  await t.db('certificates').where({ id: certificateId }).delete()
  await t.close()
})

const upload = (bytes: Buffer, filename: string, contentType: string, id = certificateId) =>
  request(t.app)
    .post(`/api/v1/certificates/${id}/document`)
    .set('Authorization', safety)
    .attach('document', bytes, { filename, contentType })

describe('certificate documents', () => {
  it('accepts a real PDF, shows it on the certificate and serves it to office staff', async () => {
    const pdf = minimalPdf()
    const res = await upload(pdf, 'TE-P1-26B.pdf', 'application/pdf')
    expect(res.status).toBe(201)
    expect(res.body).toMatchObject({
      name: 'TE-P1-26B.pdf',
      contentType: 'application/pdf',
      sizeBytes: pdf.length,
    })
    const list = await request(t.app)
      .get('/api/v1/certificates?kind=platform_pre_use')
      .set('Authorization', safety)
    const row = list.body.items.find((c: { id: number }) => c.id === certificateId)
    expect(row.document).toMatchObject({ name: 'TE-P1-26B.pdf', contentType: 'application/pdf' })
    const file = await request(t.app)
      .get(`/api/v1/certificates/${certificateId}/document`)
      .set('Authorization', `Bearer ${await t.token('supervisor')}`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = []
        r.on('data', (c: Buffer) => chunks.push(c))
        r.on('end', () => cb(null, Buffer.concat(chunks)))
      })
    expect(file.status).toBe(200)
    expect(file.headers['content-type']).toBe('application/pdf')
    expect(Buffer.compare(file.body as Buffer, pdf)).toBe(0)
  })

  it('refuses a text file renamed .pdf with 415 unsupported_type', async () => {
    const res = await upload(
      Buffer.from('Certificate of examination\nPassed.\n'),
      'certificate.pdf',
      'application/pdf',
    )
    expect(res.status).toBe(415)
    expect(res.body.error.code).toBe('unsupported_type')
  })

  it('refuses a file over 10 MB with 413 too_large', async () => {
    const big = Buffer.concat([minimalPdf(), Buffer.alloc(10 * 1024 * 1024)])
    const res = await upload(big, 'big.pdf', 'application/pdf')
    expect(res.status).toBe(413)
    expect(res.body.error.code).toBe('too_large')
  })

  it('answers 404 for a certificate that does not exist and 400 no_file without a file', async () => {
    expect((await upload(minimalPdf(), 'a.pdf', 'application/pdf', 99_999_999)).status).toBe(404)
    const none = await request(t.app)
      .post(`/api/v1/certificates/${certificateId}/document`)
      .set('Authorization', safety)
      .field('note', 'x')
    expect(none.status).toBe(400)
    expect(none.body.error.code).toBe('no_file')
  })

  it('keeps the document from crew members (403) and from the signed-out (401)', async () => {
    const crew = await request(t.app)
      .get(`/api/v1/certificates/${certificateId}/document`)
      .set('Authorization', `Bearer ${await t.token('crew')}`)
    expect(crew.status).toBe(403)
    const anon = await request(t.app).get(`/api/v1/certificates/${certificateId}/document`)
    expect(anon.status).toBe(401)
  })
})
