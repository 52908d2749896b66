// One circuit: breaker load, switch-on surge, RCD and energy (POST /api/v1/engine/circuit).
import { z } from 'zod'
import * as D from '../engine/defaults'
import { volts, share, num, int, maybeNum, str } from './engine-common'

export const breakerCurveSchema = z.enum(['B', 'C', 'D'])
export const circuitStringSchema = z.object({
  /** Current the string draws from this circuit, A (for an LED driver, VA / V: watts / (V × PF)). */
  runningAmps: z.number().min(0),
  peakAmps: z.number().min(0),
  /** How long the switch-on peak lasts, ms (an LED driver's inrush pulse width, from its data sheet). */
  peakMs: z.number().positive().max(10000).optional(),
  /** false: no switch-on data (an LED type without its driver's inrush), peakAmps is the running current. */
  surgeKnown: z.boolean().optional(),
  /** Real power, W (energy); absent: runningAmps × supplyVolts. */
  watts: z.number().min(0).optional(),
  leakageMilliamps: z.number().min(0).optional(),
})
export const rcdTypeSchema = z.enum(['general', 'S'])
export const circuitRequestSchema = z.object({
  supplyVolts: volts,
  breakerAmps: z.number().positive().max(1000),
  curve: breakerCurveSchema,
  rcdMilliamps: z.number().positive().max(3000).optional(),
  /** `general` (no delay) or `S` (time-delayed). */
  rcdType: rcdTypeSchema.default('general'),
  /** Standing leakage measured on the whole circuit, mA; when given it is used instead of the strings' sum. */
  leakageMilliamps: z.number().min(0).max(3000).optional(),
  strings: z.array(circuitStringSchema).min(1).max(500),
  continuousLoadFraction: share.default(D.CONTINUOUS_LOAD_FRACTION),
  burnHoursPerDay: z.number().min(0).max(24).default(D.DEFAULT_BURN_HOURS_PER_DAY),
  seasonDays: z.number().int().min(0).max(366).default(D.DEFAULT_SEASON_DAYS),
  tariffPerKwh: z.number().min(0).optional(),
})
export const switchOnVerdictSchema = z.enum(['safe', 'may trip', 'will trip'])

// Stable codes for the circuit's reasons; the text may be reworded, the codes keep their meaning.
export const circuitReasonCodes = [
  'running_ok', // running current within the continuous limit
  'running_over_continuous', // over 80 % of the rating, not over the rating
  'running_over_rating', // over the breaker's rating: it will trip on overload
  'surge_safe', // switch-on surge below the instant-trip band
  'surge_in_band', // inside the band: may trip
  'surge_over_band', // at or above the band's top: will trip
  'surge_short_pulse', // an LED driver's inrush is a short pulse: comparing its peak is conservative
  'surge_unknown', // some strings have no switch-on data: the surge shown is too low by an unknown amount
  'rcd_no_additional_protection', // over 30 mA or time-delayed
  'leakage_high', // standing leakage over 30 % of IΔn
  'leakage_may_trip', // standing leakage at half IΔn or more
  'leakage_not_measured', // no leakage figure for the circuit
] as const
export const circuitReasonSchema = z.object({ code: z.enum(circuitReasonCodes), text: str })

export const circuitResponseSchema = z.object({
  runningAmps: z.number(),
  continuousLimitAmps: z.number(),
  runningOk: z.boolean(),
  /** Running current above the breaker's rating: it will trip on overload whatever the switching. */
  overload: z.boolean(),
  peakAmps: z.number(),
  instantaneousBand: z.object({ lowAmps: num, highAmps: num }),
  /** 'will trip' also when the running current alone is over the rating (see overload). */
  switchOn: switchOnVerdictSchema,
  staggerGroups: int.nullable(),
  rcd: z
    .object({
      rcdType: rcdTypeSchema,
      /** null: no leakage figure given. */
      leakageMilliamps: maybeNum,
      /** 30 % of IΔn (BS 7671 reg 531.3.2, memory). */
      leakageLimitMilliamps: num,
      additionalProtection: z.boolean(),
      risk: z.enum(['ok', 'high', 'may trip', 'not measured']),
    })
    .nullable(),
  energy: z.object({
    watts: num,
    kwhPerNight: num,
    kwhPerSeason: num,
    costPerNight: maybeNum,
    costPerSeason: maybeNum,
  }),
  reasons: z.array(circuitReasonSchema),
})

export type BreakerCurve = z.infer<typeof breakerCurveSchema>
export type CircuitString = z.input<typeof circuitStringSchema>
export type CircuitRequest = z.input<typeof circuitRequestSchema>
export type CircuitResponse = z.infer<typeof circuitResponseSchema>
export type CircuitReason = z.infer<typeof circuitReasonSchema>
export type SwitchOnVerdict = z.infer<typeof switchOnVerdictSchema>
