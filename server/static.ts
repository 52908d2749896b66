import express, { type Express, type RequestHandler } from 'express'
import { existsSync, readdirSync } from 'node:fs'
import { extname, join, resolve } from 'node:path'
import { ROUTE_HTML_DIR, routeHtmlFile } from '../shared/route-html'

/** Hashed file names never change content: a year, and no revalidation (RFC 8246 `immutable`). */
export const IMMUTABLE = 'public, max-age=31536000, immutable'
/** The HTML and the service worker must be checked on every start, or a new build never arrives. */
export const NO_CACHE = 'no-cache'

/** Twins written at build time by scripts/vite/precompress.ts, best first. */
const ENCODINGS = [
  { name: 'br', ext: '.br' },
  { name: 'gzip', ext: '.gz' },
] as const

/**
 * Serves `assets/x.js.br` (or `.gz`) for `assets/x.js` when the browser accepts it: compressed once at
 * the highest level at build time instead of on every request. The set of twins is read at start-up,
 * so a request path is only ever looked up in it, never joined onto the disk path.
 */
function precompressed(assetsDir: string): RequestHandler {
  const twins = new Set(existsSync(assetsDir) ? readdirSync(assetsDir) : [])
  return (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next()
    const name = req.path.slice(1)
    // Our order (smallest first), not the browser's: Chromium lists gzip before br at equal weight.
    const encoding = ENCODINGS.find((e) => twins.has(name + e.ext) && req.acceptsEncodings(e.name) === e.name)
    res.vary('Accept-Encoding')
    if (!encoding) return next()
    res.setHeader('Content-Encoding', encoding.name)
    res.type(extname(name))
    res.sendFile(name + encoding.ext, {
      root: assetsDir,
      acceptRanges: false,
      cacheControl: false,
      etag: false,
      lastModified: false,
      headers: { 'Cache-Control': IMMUTABLE },
    })
  }
}

/**
 * The hashed files under /assets, mounted before the page-only security headers (CSP, frame and
 * referrer rules apply to documents): a page loads dozens of these, and those headers were about
 * 1 kB on each. The two that matter for a script or style sheet are kept. ETag and Last-Modified go:
 * an immutable file is never revalidated.
 */
export function serveAssets(app: Express, clientDir: string): void {
  const assets = join(resolve(clientDir), 'assets')
  app.use('/assets', (_req, res, next) => {
    res.setHeader('X-Content-Type-Options', 'nosniff')
    res.setHeader('Cross-Origin-Resource-Policy', 'same-origin')
    next()
  })
  app.use('/assets', precompressed(assets))
  app.use(
    '/assets',
    express.static(assets, {
      immutable: true,
      maxAge: '365d',
      etag: false,
      lastModified: false,
    }),
  )
  // A stale page asking for a file from an older build: a plain 404, never the HTML in its place.
  app.use('/assets', (req, res) => {
    res.status(404).json({ error: { code: 'not_found', message: `No file ${req.originalUrl}.` } })
  })
}

/**
 * Serves the rest of the built client; every other path falls back to index.html, or to the copy of it
 * built for that path (dist/routes/<path>.html, scripts/vite/route-html.ts: the first screens, which
 * name their own code and first answer so the browser fetches them with the entry).
 */
export function serveClient(app: Express, clientDir: string): void {
  const dir = resolve(clientDir)
  const routesDir = join(dir, ROUTE_HTML_DIR)
  // Read once at start-up: a request path is only looked up in this set, never joined onto the disk.
  const routeCopies = new Set(
    (existsSync(routesDir) ? readdirSync(routesDir) : []).map((f) => `${ROUTE_HTML_DIR}/${f}`),
  )
  const htmlFor = (path: string): string => {
    const file = routeHtmlFile(path)
    return routeCopies.has(file) ? file : 'index.html'
  }
  // index.html, sw.js, workbox-*.js, the manifest and icons: unhashed names, so always revalidated.
  app.use(
    express.static(dir, {
      index: false,
      cacheControl: false,
      setHeaders: (res) => res.setHeader('Cache-Control', NO_CACHE),
    }),
  )
  app.get(/^\/(?!api\/|uploads\/).*/, (req, res) => {
    // `root` keeps the check for dot-folders to the file name, so a client built into a folder such
    // as `.bench-web/dist` is still served.
    res.sendFile(htmlFor(req.path), {
      root: dir,
      cacheControl: false,
      headers: { 'Cache-Control': NO_CACHE },
    })
  })
}
