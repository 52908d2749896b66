import { describe, expect, it } from 'vitest'
import {
  assessRequestSchema,
  circuitRequestSchema,
  forecastRequestSchema,
  forecastResponseSchema,
} from '../../../shared/schemas/engine'
import { assess, forecast } from '../../../shared/engine'

const lamp = { count: 20, ratedVolts: 12, ratedAmps: 0.25 }

describe('engine request schemas', () => {
  it('fills the documented defaults', () => {
    const parsed = assessRequestSchema.parse({ supplyVolts: 240, lamps: [lamp] })
    expect(parsed).toMatchObject({ wiring: 'series', lifeExponent: 13, replaceAtRatio: 1.05 })
    expect(parsed.lamps[0]).toMatchObject({ failed: 0, shunted: true })
  })

  it('rejects more failed lamps than the class holds', () => {
    const r = assessRequestSchema.safeParse({ supplyVolts: 240, lamps: [{ ...lamp, failed: 21 }] })
    expect(r.success).toBe(false)
    expect(r.error!.issues[0].path).toEqual(['lamps', 0, 'failed'])
  })

  it('rejects a string with no lamps but accepts an empty class beside others', () => {
    expect(assessRequestSchema.safeParse({ supplyVolts: 240, lamps: [{ ...lamp, count: 0 }] }).success).toBe(
      false,
    )
    expect(assessRequestSchema.safeParse({ supplyVolts: 240, lamps: [] }).success).toBe(false)
    expect(
      assessRequestSchema.safeParse({ supplyVolts: 240, lamps: [lamp, { ...lamp, count: 0 }] }).success,
    ).toBe(true)
  })

  it('accepts a string with every lamp failed, which assesses as dark', () => {
    const input = assessRequestSchema.parse({ supplyVolts: 240, lamps: [{ ...lamp, failed: 20 }] })
    expect(assess(input).state).toBe('dark')
  })

  it('bounds volts, counts and trials', () => {
    expect(assessRequestSchema.safeParse({ supplyVolts: 0, lamps: [lamp] }).success).toBe(false)
    expect(
      assessRequestSchema.safeParse({ supplyVolts: 240, lamps: [{ ...lamp, count: 2.5 }] }).success,
    ).toBe(false)
    const forecastInput = { supplyVolts: 240, lamps: [lamp], ratedLifeHours: 1500 }
    expect(forecastRequestSchema.safeParse({ ...forecastInput, trials: 20001 }).success).toBe(false)
    expect(forecastRequestSchema.parse(forecastInput)).toMatchObject({ trials: 2000, weibullShape: 2.8 })
    expect(
      circuitRequestSchema.safeParse({ supplyVolts: 240, breakerAmps: 6, curve: 'K', strings: [] }).success,
    ).toBe(false)
  })

  it('describes what the forecast returns', () => {
    const input = forecastRequestSchema.parse({
      supplyVolts: 240,
      lamps: [lamp],
      ratedLifeHours: 1500,
      trials: 50,
      startDate: '2025-11-28',
    })
    expect(forecastResponseSchema.safeParse(forecast(input)).success).toBe(true)
  })
})
