import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs'
import { get, type IncomingHttpHeaders, type Server } from 'node:http'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { brotliCompressSync, brotliDecompressSync, gunzipSync, gzipSync } from 'node:zlib'
import { createApp } from '../../server/app'
import { makeTestApp, type TestApp } from './helpers'

// A built client in miniature: a hashed script with the brotli and gzip twins the build writes
// (scripts/vite/precompress.ts), a hashed style sheet without twins, index.html and the service worker.
const SCRIPT = `export const hello = ${JSON.stringify('lamp '.repeat(400))}\n`
const STYLE = `body { color: #222 }\n`.repeat(80)
let t: TestApp
let server: Server
let base: string
let dir: string

beforeAll(async () => {
  t = await makeTestApp()
  dir = mkdtempSync(join(tmpdir(), 'lw-static-'))
  mkdirSync(join(dir, 'assets'))
  writeFileSync(join(dir, 'index.html'), '<!doctype html><title>Lampwright</title><div id="app"></div>')
  writeFileSync(join(dir, 'sw.js'), 'self.addEventListener("fetch", () => {})')
  // The first screens' copies of index.html (scripts/vite/route-html.ts).
  mkdirSync(join(dir, 'routes'))
  writeFileSync(join(dir, 'routes', 'run.html'), '<!doctype html><title>Lampwright</title><!-- run -->')
  writeFileSync(join(dir, 'routes', 'index.html'), '<!doctype html><title>Lampwright</title><!-- sign-in -->')
  writeFileSync(join(dir, 'assets', 'index-AbC123.js'), SCRIPT)
  writeFileSync(join(dir, 'assets', 'index-AbC123.js.br'), brotliCompressSync(SCRIPT))
  writeFileSync(join(dir, 'assets', 'index-AbC123.js.gz'), gzipSync(SCRIPT))
  writeFileSync(join(dir, 'assets', 'app-XyZ789.css'), STYLE)
  const app = createApp(t.deps, { clientDir: dir })
  server = await new Promise<Server>((ok) => {
    const s = app.listen(0, () => ok(s))
  })
  base = `http://127.0.0.1:${(server.address() as { port: number }).port}`
})
afterAll(async () => {
  server?.close()
  rmSync(dir, { recursive: true, force: true })
  await t.close()
})

/** The raw answer, bytes as sent (no client-side decompression). */
function fetchRaw(path: string, acceptEncoding?: string) {
  return new Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }>((ok, fail) => {
    const headers = acceptEncoding ? { 'accept-encoding': acceptEncoding } : {}
    get(`${base}${path}`, { headers }, (res) => {
      const parts: Buffer[] = []
      res.on('data', (d: Buffer) => parts.push(d))
      res.on('end', () =>
        ok({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(parts) }),
      )
    }).on('error', fail)
  })
}

// The cache rules (RFC 9111 §5.2.2; `immutable` RFC 8246) and the content codings (RFC 9110 §8.4.1) are
// what issue 14 asks for: a year and immutable for hashed names, no-cache for the HTML and the worker.
describe('serving the built client', () => {
  it('sends the brotli twin of a hashed script to a browser that accepts br, cached for a year', async () => {
    const res = await fetchRaw('/assets/index-AbC123.js', 'gzip, deflate, br, zstd')
    expect(res.status).toBe(200)
    expect(res.headers['content-encoding']).toBe('br')
    expect(res.headers['content-type']).toMatch(/^(text|application)\/javascript/)
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable')
    expect(res.headers.vary).toMatch(/Accept-Encoding/i)
    expect(res.headers['x-content-type-options']).toBe('nosniff')
    expect(brotliDecompressSync(res.body).toString()).toBe(SCRIPT)
  })

  it('sends the gzip twin when br is not accepted, and the plain file when nothing is', async () => {
    const gz = await fetchRaw('/assets/index-AbC123.js', 'gzip')
    expect(gz.headers['content-encoding']).toBe('gzip')
    expect(gunzipSync(gz.body).toString()).toBe(SCRIPT)
    const plain = await fetchRaw('/assets/index-AbC123.js')
    expect(plain.headers['content-encoding']).toBeUndefined()
    expect(plain.body.toString()).toBe(SCRIPT)
    expect(plain.headers['cache-control']).toBe('public, max-age=31536000, immutable')
  })

  it('keeps the page-only headers off hashed assets but on the HTML', async () => {
    const asset = await fetchRaw('/assets/index-AbC123.js', 'br')
    expect(asset.headers['content-security-policy']).toBeUndefined()
    const page = await fetchRaw('/sign-in', 'gzip')
    expect(page.headers['content-security-policy']).toMatch(/default-src 'self'/)
  })

  it('answers a hashed file with no twin uncompressed from disk, still immutable', async () => {
    const res = await fetchRaw('/assets/app-XyZ789.css', 'br, gzip')
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toMatch(/^text\/css/)
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable')
    expect(res.body.toString()).toBe(STYLE)
  })

  it('serves index.html for app paths and the service worker with no-cache', async () => {
    const page = await fetchRaw('/report', 'gzip')
    expect(page.status).toBe(200)
    expect(page.headers['cache-control']).toBe('no-cache')
    expect(page.headers['content-type']).toMatch(/^text\/html/)
    const sw = await fetchRaw('/sw.js')
    expect(sw.status).toBe(200)
    expect(sw.headers['cache-control']).toBe('no-cache')
  })

  it('sends a first screen its own copy of the HTML, and index.html to every other path', async () => {
    const run = await fetchRaw('/run')
    expect(run.body.toString()).toContain('<!-- run -->')
    expect(run.headers['cache-control']).toBe('no-cache')
    expect((await fetchRaw('/')).body.toString()).toContain('<!-- sign-in -->')
    expect((await fetchRaw('/queue')).body.toString()).toContain('<div id="app">')
    // Only a known copy's name is ever read: a path is looked up, never joined onto the folder.
    expect((await fetchRaw('/routes/../run')).body.toString()).not.toContain('<!-- sign-in -->')
    expect((await fetchRaw('/run/x')).body.toString()).toContain('<div id="app">')
  })

  it('answers a missing hashed file 404 and never falls back to the HTML', async () => {
    const res = await fetchRaw('/assets/missing-000.js', 'br')
    expect(res.status).toBe(404)
    expect(res.headers['content-type'] ?? '').not.toMatch(/html/)
  })
})
