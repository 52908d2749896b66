// The basemap archive (BASEMAP_FILE, PMTiles) served from our own origin. The client reads it by HTTP
// range requests, a few kilobytes per tile, and the service worker keeps what it fetched for offline use.
import type { Express, NextFunction, Request, Response } from 'express'
import { resolve } from 'node:path'
import type { Config } from './config'
import { HttpError } from './errors'

export const BASEMAP_PATH = '/basemap.pmtiles'

export function serveBasemapFile(app: Express, config: Config): void {
  const file = config.BASEMAP_FILE
  if (!file) return
  const path = resolve(file)
  app.get(BASEMAP_PATH, (_req: Request, res: Response, next: NextFunction) => {
    res.sendFile(
      path,
      {
        acceptRanges: true,
        cacheControl: false,
        headers: {
          'Content-Type': 'application/vnd.pmtiles',
          // A day, then revalidated by ETag; ranges must reach the client byte for byte (no-transform).
          'Cache-Control': 'public, max-age=86400, no-transform',
        },
      },
      (err?: Error & { code?: string; status?: number; headers?: Record<string, string> }) => {
        if (!err) return
        if (err.code === 'ENOENT' || err.status === 404)
          return next(new HttpError(404, 'basemap_missing', 'The basemap file (BASEMAP_FILE) is missing.'))
        // A client that goes away mid-transfer is not an error of ours.
        if (res.headersSent) return
        if (err.status === 416) {
          if (err.headers?.['Content-Range']) res.setHeader('Content-Range', err.headers['Content-Range'])
          return next(
            new HttpError(416, 'range_not_satisfiable', 'That byte range is outside the basemap file.'),
          )
        }
        next(err)
      },
    )
  })
}
