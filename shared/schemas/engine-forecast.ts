// Forecast of the failure cascade (POST /api/v1/engine/forecast).
import { z } from 'zod'
import * as D from '../engine/defaults'
import { lampClassShape, lampList, notOverCount, overCount } from './engine-assess'
import { volts, hours, share, int, maybeNum, wiring, lifeExponent } from './engine-common'

export const forecastLampClassSchema = z
  .object({ ...lampClassShape, ratedLifeHours: z.number().positive().optional(), ageHours: hours.optional() })
  .refine(notOverCount, overCount)

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

export type ForecastLampClassInput = z.input<typeof forecastLampClassSchema>
export type ForecastRequest = z.input<typeof forecastRequestSchema>
export type ForecastResponse = z.infer<typeof forecastResponseSchema>
