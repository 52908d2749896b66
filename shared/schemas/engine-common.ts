// Small zod building blocks shared by the engine's request and response schemas.
import { z } from 'zod'
import * as D from '../engine/defaults'

export const volts = z.number().positive().max(1000)
export const amps = z.number().positive().max(100)
export const hours = z.number().min(0)
export const share = z.number().min(0).max(1)
export const num = z.number()
export const int = z.number().int()
export const maybeNum = num.nullable()
export const str = z.string()
export const kelvin = z.number().min(1000).max(3500).default(D.DEFAULT_OPERATING_KELVIN)
export const wiring = z.enum(['series', 'parallel']).default('series')
export const lifeExponent = z.number().min(0).max(30).default(D.DEFAULT_LIFE_EXPONENT)
