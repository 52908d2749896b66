import express, { type Express } from 'express'
import { join, resolve } from 'node:path'

/** Serves the built client: hashed assets cached for a year, every other path falls back to index.html. */
export function serveClient(app: Express, clientDir: string): void {
  const dir = resolve(clientDir)
  app.use(
    '/assets',
    express.static(join(dir, 'assets'), { immutable: true, maxAge: '365d', fallthrough: false }),
  )
  app.use(express.static(dir, { index: false, maxAge: 0 }))
  app.get(/^\/(?!api\/|uploads\/).*/, (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache')
    res.sendFile(join(dir, 'index.html'))
  })
}
