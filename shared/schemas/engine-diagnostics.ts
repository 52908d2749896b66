// Meter readings: clamp-meter estimate of shorted lamps, cold resistance, filament temperature.
import { z } from 'zod'
import * as D from '../engine/defaults'
import { lampClassSchema, lampList } from './engine-assess'
import { volts, amps, int, str, wiring } from './engine-common'

const fraction = (max: number) => z.number().min(0).max(max)
const lampsInCircuit = z.number().int().min(1).max(10000)
const range = z.object({ estimate: int, low: int, high: int })
/** chains side by side, each as described (`lampCount` or `lamps` is one chain); default 1 */
const branches = z.number().int().min(1).max(100).optional()

// A healthy string of the same type, lit: it drew `amps` at `volts` with `lampsInCircuit` lamps (in
// each chain; default as built).
const hotReadingSchema = z.object({ volts, amps, lampsInCircuit: lampsInCircuit.optional() })

export const estimateShortedRequestSchema = z.object({
  supplyVolts: volts,
  measuredAmps: amps,
  lampCount: z.number().int().min(1).max(10000),
  branches,
  ratedVolts: volts,
  ratedAmps: amps,
  /** the clamp meter's accuracy, a fraction of the reading */
  meterAccuracy: fraction(0.2).optional(),
  /** one digit of the clamp meter's display, in amps */
  meterResolutionAmps: z.number().min(0).max(1).default(D.DEFAULT_METER_RESOLUTION_AMPS),
  /** older name for meterAccuracy, used when meterAccuracy is not given */
  currentTolerance: fraction(0.2).default(D.DEFAULT_CURRENT_TOLERANCE),
  voltsTolerance: fraction(0.2).default(D.DEFAULT_VOLTS_TOLERANCE),
  lampCurrentTolerance: fraction(0.3).default(D.DEFAULT_LAMP_CURRENT_TOLERANCE),
  /** a healthy string's own reading: replaces the rating and the lamps' tolerance */
  reference: hotReadingSchema.optional(),
  stringSpread: fraction(0.2).default(D.DEFAULT_STRING_SPREAD),
})
export const estimateShortedResponseSchema = z.object({
  ...range.shape,
  finding: z.enum(['ok', 'shorted', 'dead-short', 'low-current']),
  /** what the reading can be, allowing the meter's accuracy and one digit */
  readingBand: z.object({ lowAmps: z.number(), highAmps: z.number() }),
  /** how much more current one more shorted lamp draws, near the estimate */
  ampsPerShortedLamp: z.number(),
  explanation: str,
  caution: str.nullable(),
})

// Expected resistance is for every lamp intact (as built): recorded failures are not subtracted.
export const coldResistanceRequestSchema = z.object({
  lamps: lampList(lampClassSchema),
  wiring,
  branches,
  // null = the meter read open circuit
  measuredOhms: z.number().min(0).nullable().optional(),
  /** a healthy string of this type measured cold, and how many lamps it had in circuit (each chain) */
  reference: z.object({ coldOhms: z.number().positive().max(1e7), lampsInCircuit }).optional(),
  /** without a cold reference: a healthy string's hot reading sets the hot resistance */
  hotReading: hotReadingSchema.optional(),
  /** hot ÷ cold resistance; default the bench ratio of small series lamps (11) */
  hotColdRatio: z.number().min(1).max(20).optional(),
  hotColdRatioTolerance: fraction(0.5).default(D.DEFAULT_HOT_COLD_RATIO_TOLERANCE),
  /** older way to set the ratio (tungsten table); used only when hotColdRatio is not given */
  operatingKelvin: z.number().min(1000).max(3500).optional(),
  meterAccuracy: fraction(0.2).default(D.DEFAULT_OHMMETER_ACCURACY),
  stringSpread: fraction(0.2).default(D.DEFAULT_STRING_SPREAD),
  lampCurrentTolerance: fraction(0.3).default(D.DEFAULT_LAMP_CURRENT_TOLERANCE),
})
export const coldResistanceResponseSchema = z.object({
  basis: z.enum(['reference', 'hot-reading', 'ratings']),
  hotOhms: z.number().nullable(),
  expectedOhms: z.number(),
  hotColdRatio: z.number().nullable(),
  perLampOhms: z.number(),
  /** ± share of expectedOhms that a healthy string of this type may read */
  expectedTolerance: z.number(),
  thresholds: z.object({
    openAboveOhms: z.number(),
    shortedBelowOhms: z.number(),
    deadShortBelowOhms: z.number(),
  }),
  finding: z.enum(['not-measured', 'ok', 'open', 'shorted']),
  deadShort: z.boolean(),
  shortedEstimate: range.nullable(),
  message: str,
  caution: str.nullable(),
})
export const filamentTemperatureRequestSchema = z.object({ hotColdRatio: z.number().min(1).max(20) })
export const filamentTemperatureResponseSchema = z.object({ kelvin: z.number() })

export type EstimateShortedRequest = z.input<typeof estimateShortedRequestSchema>
export type EstimateShortedResponse = z.infer<typeof estimateShortedResponseSchema>
export type ColdResistanceRequest = z.input<typeof coldResistanceRequestSchema>
export type ColdResistanceResponse = z.infer<typeof coldResistanceResponseSchema>
