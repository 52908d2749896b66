// Forecast of the failure cascade (POST /api/v1/engine/forecast).
import { z } from 'zod'
import * as D from '../engine/defaults'
import { failuresFit, lampClassShape, lampList, technologySchema } from './engine-assess'
import { volts, hours, share, int, maybeNum, wiring, lifeExponent } from './engine-common'

const ratedLife = z.number().positive().max(1e6)

export const forecastLampClassSchema = z.object({
  ...lampClassShape,
  /** median life at rated voltage (LED: e.g. L70), default the request's */
  ratedLifeHours: ratedLife.optional(),
  /** life ∝ r^−d for this class (e.g. a fuse lamp's), default the request's */
  lifeExponent: z.number().min(0).max(30).optional(),
  /** exposure: hours at rated voltage already on these lamps, default the request's lampAgeHours */
  ageHours: hours.optional(),
})

export const forecastRequestSchema = z
  .object({
    supplyVolts: volts,
    lamps: lampList(forecastLampClassSchema),
    wiring,
    /** parallel chains of the `lamps` chain; dark = the first chain still lit going out */
    branches: z.number().int().min(1).max(100).default(1),
    technology: technologySchema.default('filament'),
    // Taken so one body serves assess and forecast; the forecast does not use them (an LED's life
    // does not depend on its supply within the driver's range).
    powerFactor: z.number().gt(0).max(1).optional(),
    driverMinVolts: volts.optional(),
    driverMaxVolts: volts.optional(),
    ratedLifeHours: ratedLife,
    weibullShape: z.number().min(0.2).max(10).default(D.DEFAULT_WEIBULL_SHAPE),
    lifeExponent,
    /** rated-voltage hours already on every class without its own ageHours */
    lampAgeHours: hours.default(0),
    shuntFailProbability: share.default(D.DEFAULT_SHUNT_FAIL_PROBABILITY),
    burnHoursPerDay: z.number().positive().max(24).default(D.DEFAULT_BURN_HOURS_PER_DAY),
    startDate: z.iso.date().optional(),
    trials: z.number().int().min(1).max(D.MAX_TRIALS).default(D.DEFAULT_TRIALS),
    seed: z.number().int().min(0).max(0xffffffff).default(D.DEFAULT_SEED),
    /** burning hours from now at which to report the chance of being dark (answered in `pDarkAt`) */
    pDarkAt: z.array(hours.max(D.HORIZON_HOURS)).max(D.MAX_P_DARK_AT).optional(),
  })
  .superRefine(failuresFit)

const pAt = z.object({ hours: z.number(), p: share })

export const forecastResponseSchema = z.object({
  trials: int,
  meanHoursToFailure: z.array(maybeNum),
  standardError: z.array(maybeNum),
  pReached: z.array(share),
  meanHoursToDark: maybeNum,
  medianHoursToDark: maybeNum,
  pDarkWithinHorizon: share,
  horizonHours: z.number(),
  pDark: z.array(pAt),
  /** the chance of being dark by each of the request's `pDarkAt` hours (empty when none asked) */
  pDarkAt: z.array(pAt),
  /** per lamp class: share of trials that went dark at a failure of that class (0 when dark now) */
  darkByClass: z.array(share),
  dates: z
    .object({
      failures: z.array(z.iso.date().nullable()),
      meanDark: z.iso.date().nullable(),
      medianDark: z.iso.date().nullable(),
    })
    .optional(),
})

export type ForecastLampClassInput = z.input<typeof forecastLampClassSchema>
export type ForecastRequest = z.input<typeof forecastRequestSchema>
export type ForecastResponse = z.infer<typeof forecastResponseSchema>
