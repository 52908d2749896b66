import { z } from 'zod'
import { roleSchema } from './common'

export const healthResponse = z.object({ status: z.enum(['ok', 'degraded']), db: z.enum(['ok', 'down']) })
export const clientConfig = z.object({
  appName: z.string(),
  demoMode: z.boolean(),
  demoAccounts: z.array(z.object({ email: z.string(), role: roleSchema, name: z.string() })),
  demoPassword: z.string().nullable(),
  tiles: z.object({
    url: z.string().nullable(),
    attribution: z.string(),
    maxZoom: z.number(),
    local: z.boolean(),
  }),
  mailOutbox: z.boolean(),
  /** Which basemap to draw: `pmtiles` at `url` (same origin), a tile server, the demo's streets, or none. */
  basemap: z.object({ kind: z.enum(['pmtiles', 'tile_server', 'demo', 'none']), url: z.string().nullable() }),
  /** The app's IANA zone and BCP 47 locale: every date and number the client shows follows them. */
  timeZone: z.string(),
  locale: z.string(),
  /** PUBLIC_URL without a trailing slash when set: printed links (QR labels) use it; null, the page's own. */
  publicUrl: z.string().nullable(),
})
export const mailList = z.object({
  items: z.array(z.object({ id: z.number(), to: z.string(), subject: z.string(), createdAt: z.string() })),
})
export const mailMessage = z.object({
  id: z.number(),
  to: z.string(),
  from: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  createdAt: z.string(),
})

export const basemap = z.object({
  type: z.literal('FeatureCollection'),
  features: z.array(
    z.object({
      type: z.literal('Feature'),
      properties: z.object({ name: z.string(), kind: z.string(), widthM: z.number() }),
      geometry: z.object({ type: z.enum(['LineString', 'Polygon']), coordinates: z.array(z.unknown()) }),
    }),
  ),
})
