// GET /client-report.pdf: a real PDF (checked by its bytes and by the text pdf.js reads out of it),
// the client's name and figures in it, and the period and client checked like the JSON report.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { makeTestApp, type TestApp } from './helpers'

let t: TestApp
let manager: string
let clientId: number
beforeAll(async () => {
  t = await makeTestApp()
  manager = `Bearer ${await t.token('manager')}`
  clientId = (await t.db('clients').where({ name: 'Wrenfold Town Council' }).first('id')).id
})
afterAll(() => t.close())

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}

/** Every page's text, joined, as pdf.js (Mozilla's reader) extracts it. */
async function pdfText(buf: Buffer): Promise<string> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs')
  const doc = await pdfjs.getDocument({ data: new Uint8Array(buf), useSystemFonts: false }).promise
  const pages: string[] = []
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent()
    pages.push(content.items.map((it) => ('str' in it ? it.str : '')).join(' '))
  }
  await doc.destroy()
  // pdf.js gives words and spaces as separate pieces: one space between words is enough to read.
  return pages.join('\n').replace(/\s+/g, ' ')
}

describe('client report PDF', () => {
  it('is a PDF that names the client, its period and its register count', async () => {
    const res = await request(t.app)
      .get(`/api/v1/client-report.pdf?clientId=${clientId}&from=2026-11-01&to=2026-11-30`)
      .set('Authorization', manager)
      .buffer(true)
      .parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toMatch(/^application\/pdf/)
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="client-report-.*\.pdf"/)
    const body = res.body as Buffer
    // ISO 32000-1 §7.5.2: a PDF file begins with the header "%PDF-" and its version.
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    const text = await pdfText(body)
    expect(text).toContain('Wrenfold Town Council')
    expect(text).toContain('Client report')
    // The period as asked, in words (en-GB Intl style; hand check: 2 Dec 2026 is a Wednesday, so
    // 30 Nov is a Monday and 1 Nov, 29 days = 4 weeks + 1 day earlier, a Sunday).
    expect(text).toContain('Sun, 1 Nov 2026 to Mon, 30 Nov 2026')
    // The register count is the client's strings, counted here in the database, not by the report.
    const [{ n }] = await t
      .db('strings as s')
      .join('sites as si', 'si.id', 's.siteId')
      .where('si.clientId', clientId)
      .count({ n: '*' })
    expect(text).toMatch(new RegExp(`Strings on the register\\s+${Number(n).toLocaleString('en-GB')}`))
  })

  it('refuses a period that ends before it starts with 400 date_range_reversed', async () => {
    const res = await request(t.app)
      .get(`/api/v1/client-report.pdf?clientId=${clientId}&from=2026-12-10&to=2026-12-01`)
      .set('Authorization', manager)
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('date_range_reversed')
    // The JSON report checks the same period the same way.
    const json = await request(t.app)
      .get(`/api/v1/client-report?clientId=${clientId}&from=2026-12-10&to=2026-12-01`)
      .set('Authorization', manager)
    expect(json.status).toBe(400)
    expect(json.body.error.code).toBe('date_range_reversed')
  })

  it('answers 404 for a client that does not exist, and 403 to a crew member', async () => {
    const missing = await request(t.app)
      .get('/api/v1/client-report.pdf?clientId=999999')
      .set('Authorization', manager)
    expect(missing.status).toBe(404)
    expect(missing.body.error.code).toBe('not_found')
    const crew = await request(t.app)
      .get(`/api/v1/client-report.pdf?clientId=${clientId}`)
      .set('Authorization', `Bearer ${await t.token('crew')}`)
    expect(crew.status).toBe(403)
  })
})
