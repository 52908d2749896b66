// One circuit: breaker load, switch-on surge, RCD and energy (POST /api/v1/engine/circuit).
import { z } from 'zod'
import * as D from '../engine/defaults'
import { volts, share, num, int, maybeNum, str } from './engine-common'

export const breakerCurveSchema = z.enum(['B', 'C', 'D'])
export const circuitStringSchema = z.object({
  runningAmps: z.number().min(0),
  peakAmps: z.number().min(0),
  watts: z.number().min(0).optional(),
  leakageMilliamps: z.number().min(0).optional(),
})
export const circuitRequestSchema = z.object({
  supplyVolts: volts,
  breakerAmps: z.number().positive().max(1000),
  curve: breakerCurveSchema,
  rcdMilliamps: z.number().positive().max(3000).optional(),
  strings: z.array(circuitStringSchema).min(1).max(500),
  continuousLoadFraction: share.default(D.CONTINUOUS_LOAD_FRACTION),
  burnHoursPerDay: z.number().min(0).max(24).default(D.DEFAULT_BURN_HOURS_PER_DAY),
  seasonDays: z.number().int().min(0).max(366).default(D.DEFAULT_SEASON_DAYS),
  tariffPerKwh: z.number().min(0).optional(),
})
export const switchOnVerdictSchema = z.enum(['safe', 'may trip', 'will trip'])
export const circuitResponseSchema = z.object({
  runningAmps: z.number(),
  continuousLimitAmps: z.number(),
  runningOk: z.boolean(),
  peakAmps: z.number(),
  instantaneousBand: z.object({ lowAmps: num, highAmps: num }),
  switchOn: switchOnVerdictSchema,
  staggerGroups: int.nullable(),
  rcd: z
    .object({ leakageMilliamps: num, additionalProtection: z.boolean(), risk: z.enum(['ok', 'may trip']) })
    .nullable(),
  energy: z.object({
    watts: num,
    kwhPerNight: num,
    kwhPerSeason: num,
    costPerNight: maybeNum,
    costPerSeason: maybeNum,
  }),
  reasons: z.array(str),
})

export type BreakerCurve = z.infer<typeof breakerCurveSchema>
export type CircuitString = z.input<typeof circuitStringSchema>
export type CircuitRequest = z.input<typeof circuitRequestSchema>
export type CircuitResponse = z.infer<typeof circuitResponseSchema>
export type SwitchOnVerdict = z.infer<typeof switchOnVerdictSchema>
