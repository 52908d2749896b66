import type { TypeSpec } from '../../../shared/string-status'
import { typeDefs } from '../../../shared/lamp-catalogue'

export interface LampPreset extends TypeSpec {
  id: string
  label: string
  technology: 'filament' | 'led'
  ratedLifeHours: number
  weibullShape: number
  shuntFailProbability: number
  classes: { label: string; count: number; ratedVolts: number; ratedAmps: number; shunted: boolean }[]
}

// The catalogue of common string types (also the demo town's), so what-ifs match the strings on the map.
export const PRESETS: LampPreset[] = typeDefs.map((t) => ({ ...t, id: t.code }))

export interface CustomSpec {
  count: number
  ratedVolts: number
  ratedAmps: number
  fuseLamp: boolean
  wiring: 'series' | 'parallel'
  technology: 'filament' | 'led'
  /** chains of `count` lamps side by side */
  branches: number
  ratedLifeHours: number
}

export const CUSTOM_DEFAULT: CustomSpec = {
  count: 20,
  ratedVolts: 12,
  ratedAmps: 0.5,
  fuseLamp: true,
  wiring: 'series',
  technology: 'filament',
  branches: 1,
  ratedLifeHours: 1000,
}

/**
 * A custom string as a preset: `count` lamps per chain, `branches` chains side by side, one lamp of
 * each chain the fuse lamp when asked for (filament series only: an LED section has no shunt).
 */
export function customPreset(c: CustomSpec): LampPreset {
  const series = c.wiring === 'series'
  const led = c.technology === 'led'
  const fuse = series && !led && c.fuseLamp && c.count > 1
  const lamp = { ratedVolts: c.ratedVolts, ratedAmps: c.ratedAmps }
  const label = led ? 'LED section' : 'Lamps'
  return {
    id: 'custom',
    label: 'Custom',
    technology: c.technology,
    wiring: c.wiring,
    branches: c.branches,
    supplyVolts: 230,
    lifeExponent: 13,
    replaceAtRatio: 1.05,
    ratedLifeHours: c.ratedLifeHours,
    weibullShape: 2.8,
    shuntFailProbability: series && !led ? 0.02 : 0,
    classes: fuse
      ? [
          { label, count: c.count - 1, ...lamp, shunted: true },
          { label: 'Fuse lamp', count: 1, ...lamp, shunted: false },
        ]
      : [{ label, count: c.count, ...lamp, shunted: series && !led }],
  }
}
