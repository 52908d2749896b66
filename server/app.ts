import express, { Router } from 'express'
import helmet from 'helmet'
import compression from 'compression'
import cookieParser from 'cookie-parser'
import { pinoHttp } from 'pino-http'
import { randomUUID } from 'node:crypto'
import { existsSync } from 'node:fs'
import { join } from 'node:path'
import type { AppDeps } from './deps'
import { authenticate } from './middleware/authenticate'
import { sameOrigin } from './middleware/same-origin'
import { apiNotFound, errorHandler } from './middleware/error-handler'
import { mountRoutes } from './route-table'
import { allRoutes } from './routes/index'
import { API_PREFIX, buildOpenApi } from './openapi'
import { tileOrigin } from './services/tiles'
import { serveAssets, serveClient } from './static'
import { serveBasemapFile } from './basemap-file'
import { logger } from './logger'

const REQUEST_ID = /^[A-Za-z0-9._-]{1,64}$/

export function createApp(deps: AppDeps, opts: { clientDir?: string } = {}) {
  const app = express()
  // Off unless TRUST_PROXY names the proxies in front: otherwise X-Forwarded-For could pick req.ip.
  app.set('trust proxy', deps.config.TRUST_PROXY)
  app.disable('x-powered-by')
  const tiles = tileOrigin(deps.config)
  const clientDir = opts.clientDir ?? join(process.cwd(), 'dist')
  const hasClient = existsSync(join(clientDir, 'index.html'))
  // Hashed scripts and styles first, without the page-only headers below (server/static.ts).
  if (hasClient) serveAssets(app, clientDir)
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:', ...(tiles ? [tiles] : [])],
          // Fonts and icons ship with the app; Quasar sets inline styles.
          'font-src': ["'self'", 'data:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'connect-src': ["'self'"],
          'worker-src': ["'self'", 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  )
  app.use(compression())
  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        // A caller's id is kept for tracing only when short and plain; it ends up in logs and audit rows.
        const given = req.headers['x-request-id']
        const id = typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID()
        res.setHeader('x-request-id', id)
        return id
      },
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api/') },
      // One short line a request: who asked for what and the answer's status, not every header (the
      // request id finds the rest). Every request serializes its bindings, so this is CPU on each.
      serializers: {
        req: (req: { id: unknown; method: string; url: string; remoteAddress?: string }) => ({
          id: req.id,
          method: req.method,
          url: req.url,
          remoteAddress: req.remoteAddress,
        }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  )
  app.use(cookieParser())
  app.use('/api', sameOrigin(deps.config))
  // A 1,000-stop travel matrix is several megabytes of JSON; everything else stays small.
  app.use(`${API_PREFIX}/routing`, express.json({ limit: '24mb' }))
  app.use(express.json({ limit: '1mb' }))

  const api = Router()
  api.use(authenticate(deps))
  const openapi = buildOpenApi(allRoutes)
  api.get('/openapi.json', (_req, res) => {
    res.json(openapi)
  })
  mountRoutes(api, allRoutes, deps)
  api.use(apiNotFound)
  app.use(API_PREFIX, api)
  app.use('/api', apiNotFound)

  serveBasemapFile(app, deps.config)
  if (hasClient) serveClient(app, clientDir)
  app.use(errorHandler)
  return app
}
