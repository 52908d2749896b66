import type { TypeSpec } from '../../../shared/string-status'

export interface LampPreset extends TypeSpec {
  id: string
  label: string
  technology: 'filament' | 'led'
  ratedLifeHours: number
  weibullShape: number
  shuntFailProbability: number
  classes: { label: string; count: number; ratedVolts: number; ratedAmps: number; shunted: boolean }[]
}

// The demo town's lamp types (seeds/demo/types.ts), so what-ifs match the strings on the map.
// Filament figures: life exponent 13 and replace-now at 105 % are the engine's defaults
// (shared/engine/defaults.ts, with sources); Weibull shape 2.8 fits the ReliaWiki lamp sample.
export const PRESETS: LampPreset[] = [
  {
    id: 'catenary-20',
    label: 'Catenary: 19 × 12 V + 12 V fuse lamp',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 230,
    lifeExponent: 13,
    replaceAtRatio: 1.05,
    ratedLifeHours: 1500,
    weibullShape: 2.8,
    shuntFailProbability: 0.02,
    classes: [
      { label: 'Lamps', count: 19, ratedVolts: 12, ratedAmps: 0.5, shunted: true },
      { label: 'Fuse lamp', count: 1, ratedVolts: 12, ratedAmps: 0.5, shunted: false },
    ],
  },
  {
    id: 'festoon-30',
    label: 'Festoon: 29 × 8 V + 8 V fuse lamp',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 230,
    lifeExponent: 13,
    replaceAtRatio: 1.05,
    ratedLifeHours: 2000,
    weibullShape: 2.8,
    shuntFailProbability: 0.02,
    classes: [
      { label: 'Lamps', count: 29, ratedVolts: 8, ratedAmps: 0.3, shunted: true },
      { label: 'Fuse lamp', count: 1, ratedVolts: 8, ratedAmps: 0.3, shunted: false },
    ],
  },
  {
    id: 'tree-wrap-100',
    label: 'Tree wrap: 100 × 2.5 V mini lamps',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 230,
    lifeExponent: 13,
    replaceAtRatio: 1.05,
    ratedLifeHours: 3000,
    weibullShape: 2.8,
    shuntFailProbability: 0.03,
    classes: [{ label: 'Mini lamps', count: 100, ratedVolts: 2.5, ratedAmps: 0.17, shunted: true }],
  },
  {
    id: 'motif-led',
    label: 'LED motif, 230 V parallel',
    technology: 'led',
    wiring: 'parallel',
    supplyVolts: 230,
    lifeExponent: 13,
    replaceAtRatio: 1.05,
    ratedLifeHours: 30000,
    weibullShape: 1.5,
    shuntFailProbability: 0,
    classes: [{ label: 'LED modules', count: 12, ratedVolts: 230, ratedAmps: 0.01, shunted: false }],
  },
]

export interface CustomSpec {
  count: number
  ratedVolts: number
  ratedAmps: number
  fuseLamp: boolean
  wiring: 'series' | 'parallel'
  ratedLifeHours: number
}

export const CUSTOM_DEFAULT: CustomSpec = {
  count: 20,
  ratedVolts: 12,
  ratedAmps: 0.5,
  fuseLamp: true,
  wiring: 'series',
  ratedLifeHours: 1000,
}

/** A custom string as a preset: `count` lamps in all, one of them the fuse lamp when asked for. */
export function customPreset(c: CustomSpec): LampPreset {
  const series = c.wiring === 'series'
  const fuse = series && c.fuseLamp && c.count > 1
  const lamp = { ratedVolts: c.ratedVolts, ratedAmps: c.ratedAmps }
  return {
    id: 'custom',
    label: 'Custom',
    technology: 'filament',
    wiring: c.wiring,
    supplyVolts: 230,
    lifeExponent: 13,
    replaceAtRatio: 1.05,
    ratedLifeHours: c.ratedLifeHours,
    weibullShape: 2.8,
    shuntFailProbability: series ? 0.02 : 0,
    classes: fuse
      ? [
          { label: 'Lamps', count: c.count - 1, ...lamp, shunted: true },
          { label: 'Fuse lamp', count: 1, ...lamp, shunted: false },
        ]
      : [{ label: 'Lamps', count: c.count, ...lamp, shunted: series }],
  }
}
