// Lamp classes, assessment of one string now, and one string's load (POST /api/v1/engine/assess).
import { z } from 'zod'
import * as D from '../engine/defaults'
import { engineStateSchema } from './string-states'
import { volts, amps, int, str, kelvin, wiring, lifeExponent } from './engine-common'

export const lampClassShape = {
  count: z.number().int().min(0).max(10000),
  ratedVolts: volts,
  ratedAmps: amps,
  failed: z.number().int().min(0).default(0),
  shunted: z.boolean().default(true),
}
export const notOverCount = (c: { count: number; failed: number }) => c.failed <= c.count
export const overCount = { message: 'failed cannot exceed count', path: ['failed'] }

export const lampClassSchema = z.object(lampClassShape).refine(notOverCount, overCount)
const hasLamp = (list: { count: number }[]) => list.reduce((n, c) => n + c.count, 0) >= 1
export const lampList = <T extends z.ZodType<{ count: number }>>(item: T) =>
  z.array(item).min(1).max(50).refine(hasLamp, 'a string needs at least one lamp')

export const assessRequestSchema = z.object({
  supplyVolts: volts,
  lamps: lampList(lampClassSchema),
  wiring,
  lifeExponent,
  replaceAtRatio: z.number().min(1).max(2).default(D.DEFAULT_REPLACE_AT_RATIO),
})

export const assessClassSchema = z.object({
  lampsInCircuit: int,
  voltsPerLamp: z.number(),
  ratio: z.number(),
  currentFactor: z.number(),
  powerFactor: z.number(),
  lightFactor: z.number(),
  lifeFactor: z.number(),
})
export const assessResponseSchema = z.object({
  lit: z.boolean(),
  state: engineStateSchema,
  stringAmps: z.number(),
  stringWatts: z.number(),
  maxRatio: z.number(),
  replaceNow: z.boolean(),
  reasons: z.array(str),
  classes: z.array(assessClassSchema),
})

export const stringLoadRequestSchema = assessRequestSchema.extend({
  technology: z.enum(['filament', 'led']).default('filament'),
  operatingKelvin: kelvin,
  ledInrushMultiple: z.number().min(1).max(100).default(D.DEFAULT_LED_INRUSH_MULTIPLE),
})

export type LampClassInput = z.input<typeof lampClassSchema>
export type AssessRequest = z.input<typeof assessRequestSchema>
export type AssessResponse = z.infer<typeof assessResponseSchema>
export type AssessClass = z.infer<typeof assessClassSchema>
export type StringLoadRequest = z.input<typeof stringLoadRequestSchema>
