// A catalogue of common string types, used by the demo town and offered as calculator presets.
// Ratings are typical of the products crews hang (common practice, no single source); life exponent
// 13 and Weibull shape 2.8 are the engine's documented defaults (shared/engine/defaults.ts).
export interface TypeDef {
  code: string
  name: string
  /** a short name for pickers */
  label: string
  technology: 'filament' | 'led'
  wiring: 'series' | 'parallel'
  supplyVolts: number
  ratedLifeHours: number
  lifeExponent: number
  weibullShape: number
  replaceAtRatio: number
  shuntFailProbability: number
  lengthM: number
  classes: { label: string; count: number; ratedVolts: number; ratedAmps: number; shunted: boolean }[]
}

export const typeDefs: TypeDef[] = [
  {
    code: 'CAT-F20',
    label: 'Catenary: 19 × 12 V + 12 V fuse lamp',
    name: 'Cross-street catenary, 19 × 12 V filament + 12 V fuse lamp',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 230,
    ratedLifeHours: 1500,
    lifeExponent: 13,
    weibullShape: 2.8,
    replaceAtRatio: 1.05,
    shuntFailProbability: 0.02,
    lengthM: 16,
    classes: [
      { label: 'Lamp', count: 19, ratedVolts: 12, ratedAmps: 0.5, shunted: true },
      { label: 'Fuse lamp', count: 1, ratedVolts: 12, ratedAmps: 0.5, shunted: false },
    ],
  },
  {
    code: 'FES-F30',
    label: 'Festoon: 29 × 8 V + 8 V fuse lamp',
    name: 'Festoon, 29 × 8 V filament + 8 V fuse lamp',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 230,
    ratedLifeHours: 2000,
    lifeExponent: 13,
    weibullShape: 2.8,
    replaceAtRatio: 1.05,
    shuntFailProbability: 0.02,
    lengthM: 30,
    classes: [
      { label: 'Lamp', count: 29, ratedVolts: 8, ratedAmps: 0.3, shunted: true },
      { label: 'Fuse lamp', count: 1, ratedVolts: 8, ratedAmps: 0.3, shunted: false },
    ],
  },
  {
    code: 'WRAP-M100',
    label: 'Tree wrap: 100 × 2.5 V mini lamps',
    name: 'Tree wrap, 100 × 2.5 V mini lamps',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 230,
    ratedLifeHours: 3000,
    lifeExponent: 13,
    weibullShape: 2.8,
    replaceAtRatio: 1.05,
    shuntFailProbability: 0.03,
    lengthM: 20,
    classes: [{ label: 'Mini lamp', count: 100, ratedVolts: 2.5, ratedAmps: 0.17, shunted: true }],
  },
  {
    code: 'MOT-L',
    label: 'LED motif, 230 V parallel',
    name: 'Column motif, LED 230 V',
    technology: 'led',
    wiring: 'parallel',
    supplyVolts: 230,
    ratedLifeHours: 30000,
    lifeExponent: 13,
    weibullShape: 1.5,
    replaceAtRatio: 1.05,
    shuntFailProbability: 0,
    lengthM: 2,
    classes: [{ label: 'LED module', count: 12, ratedVolts: 230, ratedAmps: 0.01, shunted: false }],
  },
  {
    code: 'CUR-L',
    label: 'LED curtain, 24 V parallel',
    name: 'Curtain, LED 24 V',
    technology: 'led',
    wiring: 'parallel',
    supplyVolts: 24,
    ratedLifeHours: 25000,
    lifeExponent: 13,
    weibullShape: 1.5,
    replaceAtRatio: 1.05,
    shuntFailProbability: 0,
    lengthM: 6,
    classes: [{ label: 'LED drop', count: 40, ratedVolts: 24, ratedAmps: 0.02, shunted: false }],
  },
]
