// Request and response shapes of the string engine (POST /api/v1/engine/*), plain zod 4. Engine functions
// take the *input* types (defaults optional) so the client can preview; the server parses first.
import { z } from 'zod'
import * as D from '../engine/defaults'
import { engineStateSchema } from './string-states'

const volts = z.number().positive().max(1000)
const amps = z.number().positive().max(100)
const hours = z.number().min(0)
const share = z.number().min(0).max(1)
const num = z.number()
const int = z.number().int()
const maybeNum = num.nullable()
const str = z.string()
const kelvin = z.number().min(1000).max(3500).default(D.DEFAULT_OPERATING_KELVIN)

const lampClassShape = {
  count: z.number().int().min(0).max(10000),
  ratedVolts: volts,
  ratedAmps: amps,
  failed: z.number().int().min(0).default(0),
  shunted: z.boolean().default(true),
}
const notOverCount = (c: { count: number; failed: number }) => c.failed <= c.count
const overCount = { message: 'failed cannot exceed count', path: ['failed'] }

export const lampClassSchema = z.object(lampClassShape).refine(notOverCount, overCount)
export const forecastLampClassSchema = z
  .object({ ...lampClassShape, ratedLifeHours: z.number().positive().optional(), ageHours: hours.optional() })
  .refine(notOverCount, overCount)

const hasLamp = (list: { count: number }[]) => list.reduce((n, c) => n + c.count, 0) >= 1
const lampList = <T extends z.ZodType<{ count: number }>>(item: T) =>
  z.array(item).min(1).max(50).refine(hasLamp, 'a string needs at least one lamp')

const wiring = z.enum(['series', 'parallel']).default('series')
const lifeExponent = z.number().min(0).max(30).default(D.DEFAULT_LIFE_EXPONENT)

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

export const forecastRequestSchema = z.object({
  supplyVolts: volts,
  lamps: lampList(forecastLampClassSchema),
  wiring,
  ratedLifeHours: z.number().positive().max(1e6),
  weibullShape: z.number().min(0.2).max(10).default(D.DEFAULT_WEIBULL_SHAPE),
  lifeExponent,
  lampAgeHours: hours.default(0),
  shuntFailProbability: share.default(D.DEFAULT_SHUNT_FAIL_PROBABILITY),
  burnHoursPerDay: z.number().positive().max(24).default(D.DEFAULT_BURN_HOURS_PER_DAY),
  startDate: z.iso.date().optional(),
  trials: z.number().int().min(1).max(D.MAX_TRIALS).default(D.DEFAULT_TRIALS),
  seed: z.number().int().min(0).max(0xffffffff).default(D.DEFAULT_SEED),
})

export const forecastResponseSchema = z.object({
  trials: int,
  meanHoursToFailure: z.array(maybeNum),
  standardError: z.array(maybeNum),
  pReached: z.array(share),
  meanHoursToDark: maybeNum,
  medianHoursToDark: maybeNum,
  pDarkWithinHorizon: share,
  horizonHours: z.number(),
  pDark: z.array(z.object({ hours: z.number(), p: share })),
  dates: z
    .object({
      failures: z.array(z.iso.date().nullable()),
      meanDark: z.iso.date().nullable(),
      medianDark: z.iso.date().nullable(),
    })
    .optional(),
})

export const estimateShortedRequestSchema = z.object({
  supplyVolts: volts,
  measuredAmps: amps,
  lampCount: z.number().int().min(1).max(10000),
  ratedVolts: volts,
  ratedAmps: amps,
  currentTolerance: z.number().min(0).max(0.2).default(D.DEFAULT_CURRENT_TOLERANCE),
  voltsTolerance: z.number().min(0).max(0.2).default(D.DEFAULT_VOLTS_TOLERANCE),
})
export const estimateShortedResponseSchema = z.object({
  estimate: int,
  low: int,
  high: int,
  explanation: str,
})

// Expected resistance is for every lamp intact (as built): recorded failures are not subtracted.
export const coldResistanceRequestSchema = z.object({
  lamps: lampList(lampClassSchema),
  wiring,
  operatingKelvin: kelvin,
  // null = the meter read open circuit
  measuredOhms: z.number().min(0).nullable().optional(),
})
export const coldResistanceResponseSchema = z.object({
  hotOhms: z.number(),
  expectedOhms: z.number(),
  hotColdRatio: z.number(),
  finding: z.enum(['not-measured', 'ok', 'open', 'shorted']),
  shortedEstimate: int.nullable(),
  message: str,
})
export const filamentTemperatureRequestSchema = z.object({ hotColdRatio: z.number().min(1).max(20) })
export const filamentTemperatureResponseSchema = z.object({ kelvin: z.number() })

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

export const stringLoadRequestSchema = assessRequestSchema.extend({
  technology: z.enum(['filament', 'led']).default('filament'),
  operatingKelvin: kelvin,
  ledInrushMultiple: z.number().min(1).max(100).default(D.DEFAULT_LED_INRUSH_MULTIPLE),
})

export type LampClassInput = z.input<typeof lampClassSchema>
export type ForecastLampClassInput = z.input<typeof forecastLampClassSchema>
export type AssessRequest = z.input<typeof assessRequestSchema>
export type AssessResponse = z.infer<typeof assessResponseSchema>
export type AssessClass = z.infer<typeof assessClassSchema>
export type ForecastRequest = z.input<typeof forecastRequestSchema>
export type ForecastResponse = z.infer<typeof forecastResponseSchema>
export type EstimateShortedRequest = z.input<typeof estimateShortedRequestSchema>
export type EstimateShortedResponse = z.infer<typeof estimateShortedResponseSchema>
export type ColdResistanceRequest = z.input<typeof coldResistanceRequestSchema>
export type ColdResistanceResponse = z.infer<typeof coldResistanceResponseSchema>
export type BreakerCurve = z.infer<typeof breakerCurveSchema>
export type CircuitString = z.input<typeof circuitStringSchema>
export type CircuitRequest = z.input<typeof circuitRequestSchema>
export type CircuitResponse = z.infer<typeof circuitResponseSchema>
export type SwitchOnVerdict = z.infer<typeof switchOnVerdictSchema>
export type StringLoadRequest = z.input<typeof stringLoadRequestSchema>
