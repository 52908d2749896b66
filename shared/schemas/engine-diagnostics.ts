// Meter readings: clamp-meter estimate of shorted lamps, cold resistance, filament temperature.
import { z } from 'zod'
import * as D from '../engine/defaults'
import { lampClassSchema, lampList } from './engine-assess'
import { volts, amps, int, str, kelvin, wiring } from './engine-common'

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

export type EstimateShortedRequest = z.input<typeof estimateShortedRequestSchema>
export type EstimateShortedResponse = z.infer<typeof estimateShortedResponseSchema>
export type ColdResistanceRequest = z.input<typeof coldResistanceRequestSchema>
export type ColdResistanceResponse = z.infer<typeof coldResistanceResponseSchema>
