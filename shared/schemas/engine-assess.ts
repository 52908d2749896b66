// Lamp classes, assessment of one string now, and one string's load (POST /api/v1/engine/assess).
import { z } from 'zod'
import * as D from '../engine/defaults'
import { reasonCodes } from '../engine/reason-codes'
import { engineStateSchema } from './string-states'
import { volts, amps, int, num, maybeNum, str, kelvin, wiring, lifeExponent } from './engine-common'

export const technologySchema = z.enum(['filament', 'led'])
const lampsMissing = z.number().int().min(0).default(0)

export const lampClassShape = {
  count: z.number().int().min(0).max(10000),
  ratedVolts: volts,
  ratedAmps: amps,
  /** failed lamps: shorted by their shunt (series), or open when the class has no shunt (fuse lamp) */
  failed: lampsMissing,
  /** failed lamps whose shunt did not close: their chain is open */
  opened: lampsMissing,
  /** lamps missing from their sockets: their chain is open */
  removed: lampsMissing,
  shunted: z.boolean().default(true),
  technology: technologySchema.optional(),
}
type Missing = { count: number; failed: number; opened?: number; removed?: number }
const missing = (c: Missing) => c.failed + (c.opened ?? 0) + (c.removed ?? 0)
/** One class on its own (one chain): failed, opened and removed lamps fit in its count. */
export const notOverCount = (c: Missing) => missing(c) <= c.count
export const overCount = { message: 'failed, opened and removed lamps cannot exceed count', path: ['failed'] }

export const lampClassSchema = z.object(lampClassShape).refine(notOverCount, overCount)
const hasLamp = (list: { count: number }[]) => list.reduce((n, c) => n + c.count, 0) >= 1
export const lampList = <T extends z.ZodType<{ count: number }>>(item: T) =>
  z.array(item).min(1).max(50).refine(hasLamp, 'a string needs at least one lamp')

/**
 * Request-level checks: `lamps` describes one chain, failures count over the whole string, so each
 * class's failed + opened + removed fit in count × branches; a driver range runs low to high.
 */
export function failuresFit(
  req: { lamps: Missing[]; branches?: number; driverMinVolts?: number; driverMaxVolts?: number },
  ctx: z.RefinementCtx,
): void {
  const m = req.branches ?? 1
  req.lamps.forEach((c, i) => {
    if (missing(c) > c.count * m)
      ctx.addIssue({
        code: 'custom',
        path: ['lamps', i, 'failed'],
        message: `failed, opened and removed lamps (${missing(c)}) cannot exceed count × branches (${c.count * m})`,
      })
  })
  if (req.driverMinVolts != null && req.driverMaxVolts != null && req.driverMinVolts > req.driverMaxVolts)
    ctx.addIssue({
      code: 'custom',
      path: ['driverMinVolts'],
      message: 'driverMinVolts cannot be above driverMaxVolts',
    })
}

const assessShape = {
  supplyVolts: volts,
  lamps: lampList(z.object(lampClassShape)),
  wiring,
  /** parallel chains of the `lamps` chain */
  branches: z.number().int().min(1).max(100).default(1),
  technology: technologySchema.default('filament'),
  /** LED only: watts = volts × amps × power factor */
  powerFactor: z.number().gt(0).max(1).default(D.DEFAULT_LED_POWER_FACTOR),
  /** LED only: the driver's input range (default the nominal ±10 %, EN 50160) */
  driverMinVolts: volts.optional(),
  driverMaxVolts: volts.optional(),
  lifeExponent,
  replaceAtRatio: z.number().min(1).max(2).default(D.DEFAULT_REPLACE_AT_RATIO),
}
export const assessRequestSchema = z.object(assessShape).superRefine(failuresFit)

export const reasonSchema = z.object({ code: z.enum(reasonCodes), text: str })

// Figures the filament laws give are null where the laws do not hold (`lawsApply` false) or do not
// apply (LED): no extrapolated amps, watts, light or life.
export const assessClassSchema = z.object({
  /** lamps in their sockets and not failed (shorted lamps excluded), every chain */
  lampsInCircuit: int,
  /** lamps lit: in circuit in a chain that is not dark */
  lampsLit: int,
  /** in the most stressed lit chain */
  voltsPerLamp: num,
  ratio: num,
  ampsPerLamp: maybeNum,
  wattsPerLamp: maybeNum,
  currentFactor: maybeNum,
  powerFactor: maybeNum,
  lightFactor: maybeNum,
  lifeFactor: maybeNum,
})
export const assessResponseSchema = z.object({
  lit: z.boolean(),
  state: engineStateSchema,
  technology: technologySchema,
  /** the filament lamp laws were used and hold for every lamp lit */
  lawsApply: z.boolean(),
  stringVolts: num,
  stringAmps: maybeNum,
  /** = stringVolts × stringAmps × powerFactor */
  stringWatts: maybeNum,
  /** electrical power factor of the string (1 for filament) */
  powerFactor: num,
  branches: int,
  branchesDark: int,
  maxRatio: num,
  replaceNow: z.boolean(),
  reasons: z.array(reasonSchema),
  classes: z.array(assessClassSchema),
})

const loadShape = {
  ...assessShape,
  /** hot ÷ cold filament resistance; default the bench ratio of small series lamps (defaults.ts) */
  hotColdRatio: z.number().min(1).max(30).optional(),
  /** older way to set the ratio (tungsten table); used only when hotColdRatio is not given */
  operatingKelvin: kelvin.unwrap().optional(),
  /** LED driver switch-on: peak amps and how long it lasts (from the type's data) */
  inrushPeakAmps: z.number().min(0).max(1000).optional(),
  inrushMs: z.number().min(0).max(10000).optional(),
  /** @deprecated a maker's multiple of running current; prefer inrushPeakAmps. No default. */
  ledInrushMultiple: z.number().min(1).max(100).optional(),
}
export const stringLoadRequestSchema = z.object(loadShape).superRefine(failuresFit)

export type Technology = z.infer<typeof technologySchema>
export type LampClassInput = z.input<typeof lampClassSchema>
export type AssessRequest = z.input<typeof assessRequestSchema>
export type AssessResponse = z.infer<typeof assessResponseSchema>
export type AssessClass = z.infer<typeof assessClassSchema>
export type EngineReason = z.infer<typeof reasonSchema>
export type StringLoadRequest = z.input<typeof stringLoadRequestSchema>
