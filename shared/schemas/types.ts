import { z } from 'zod'
import { stringTypeSchema } from './strings'

export const stringTypeRow = stringTypeSchema.extend({ strings: z.number() })
export const stringTypeList = z.object({ items: z.array(stringTypeRow) })

// Bounds: life exponent 12–16 is the published range (trade-reference §3); a replace-now ratio below
// 1.0 would flag strings running under their rating.
export const stringTypePatch = z
  .object({
    replaceAtRatio: z.number().min(1).max(1.5).optional(),
    lifeExponent: z.number().min(8).max(20).optional(),
    weibullShape: z.number().min(0.5).max(8).optional(),
    shuntFailProbability: z.number().min(0).max(0.5).optional(),
    ratedLifeHours: z.number().int().min(100).max(200000).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change.')
export const stringTypeUpdated = z.object({ type: stringTypeRow, restated: z.number() })

export const systemSettings = z.object({
  tiles: z.object({
    source: z.enum(['basemap_file', 'tile_server', 'demo_basemap', 'none']),
    url: z.string().nullable(),
  }),
  mail: z.object({ transport: z.enum(['local_fake', 'smtp']), from: z.string() }),
  routing: z.object({ source: z.enum(['straight_line', 'routing_service']), url: z.string().nullable() }),
  demoMode: z.boolean(),
  sessionHours: z.number(),
})
