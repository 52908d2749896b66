import { DEFAULT_LIFE_EXPONENT, LAWS_MAX_RATIO, LAWS_MIN_RATIO } from './defaults'

// Filament lamp voltage laws, r = applied / rated voltage.
// Exponents from Wikipedia "Lamp rerating", citing Fink & Beaty, Standard Handbook for Electrical
// Engineers, 11th ed. (1978), p. 22-8.
export const CURRENT_EXPONENT = 0.55
export const POWER_EXPONENT = 1.6
// 3.4–3.5 in the same source; Lamptech "Voltage variation effects" gives ≈ 3.5 % light per 1 % volts.
export const LIGHT_EXPONENT = 3.4

export interface LampFactors {
  currentFactor: number
  powerFactor: number
  lightFactor: number
  lifeFactor: number
}

export function lampFactors(ratio: number, lifeExponent = DEFAULT_LIFE_EXPONENT): LampFactors {
  if (ratio <= 0) return { currentFactor: 0, powerFactor: 0, lightFactor: 0, lifeFactor: 0 }
  return {
    currentFactor: ratio ** CURRENT_EXPONENT,
    powerFactor: ratio ** POWER_EXPONENT,
    lightFactor: ratio ** LIGHT_EXPONENT,
    lifeFactor: ratio ** -lifeExponent,
  }
}

/** Where a ratio sits against the range the laws are trusted in (defaults.ts LAWS_MIN/MAX_RATIO). */
export function lawsRange(ratio: number): 'low' | 'ok' | 'high' {
  if (ratio > LAWS_MAX_RATIO + 1e-12) return 'high'
  if (ratio < LAWS_MIN_RATIO - 1e-12) return 'low'
  return 'ok'
}
