// A catalogue of common string types, used by the demo town and offered as calculator presets.
// Ratings are typical of the products crews hang (common practice, no single source); life exponent
// 13 and Weibull shape 2.8 are the engine's documented defaults (shared/engine/defaults.ts).
//
// Fuse lamps are rated a little lower in voltage than the other lamps at the same current and have no
// shunt, so under over-stress they fail first and put the string out before the rest burn up
// (trade-reference §2a). "A little lower" is 11 V beside 12 V lamps and 7.5 V beside 8 V lamps: common
// practice, no source.
// LED driver figures (power factor, input range, switch-on surge) are typical data-sheet figures,
// demo: set each from the maker's data sheet.
import { FUSE_LAMP_LIFE_EXPONENT } from './engine/defaults'
import type { ClassSpec } from './string-status'

/** A catalogue lamp class: the recorded class (string-status.ts ClassSpec) with its label. */
export interface ClassDef extends ClassSpec {
  label: string
}

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
  branches?: number
  powerFactor?: number | null
  driverMinVolts?: number | null
  driverMaxVolts?: number | null
  inrushPeakAmps?: number | null
  inrushMs?: number | null
  referenceColdOhms?: number | null
  referenceHotAmps?: number | null
  referenceVolts?: number | null
  hotColdRatio?: number | null
  classes: ClassDef[]
}

export const typeDefs: TypeDef[] = [
  {
    code: 'CAT-F20',
    label: 'Catenary: 19 × 12 V + 11 V fuse lamp',
    name: 'Cross-street catenary, 19 × 12 V filament + 11 V fuse lamp',
    technology: 'filament',
    wiring: 'series',
    supplyVolts: 230,
    ratedLifeHours: 1500,
    lifeExponent: 13,
    weibullShape: 2.8,
    replaceAtRatio: 1.05,
    shuntFailProbability: 0.02,
    lengthM: 16,
    // Reference measurement of a healthy string, demo (invented): 230 V / 0.4896 A ≈ 470 Ω hot and a
    // hot/cold ratio near 11 as the trade's bench figures show for small series lamps (trade-reference
    // §2a, a bench measurement, common practice) → about 42.7 Ω cold.
    referenceColdOhms: 42.7,
    referenceHotAmps: 0.4896,
    referenceVolts: 230,
    hotColdRatio: 11,
    classes: [
      { label: 'Lamp', count: 19, ratedVolts: 12, ratedAmps: 0.5, shunted: true },
      {
        label: 'Fuse lamp',
        count: 1,
        ratedVolts: 11,
        ratedAmps: 0.5,
        shunted: false,
        lifeExponent: FUSE_LAMP_LIFE_EXPONENT,
      },
    ],
  },
  {
    code: 'FES-F30',
    label: 'Festoon: 29 × 8 V + 7.5 V fuse lamp',
    name: 'Festoon, 29 × 8 V filament + 7.5 V fuse lamp',
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
      {
        label: 'Fuse lamp',
        count: 1,
        ratedVolts: 7.5,
        ratedAmps: 0.3,
        shunted: false,
        lifeExponent: FUSE_LAMP_LIFE_EXPONENT,
      },
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
    // Typical data-sheet figures, demo: a small constant-voltage driver.
    powerFactor: 0.9,
    driverMinVolts: 100,
    driverMaxVolts: 264,
    inrushPeakAmps: 10,
    inrushMs: 1,
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
    // Typical data-sheet figures, demo: a 20 W 24 V driver on the 230 V circuit.
    powerFactor: 0.55,
    driverMinVolts: 180,
    driverMaxVolts: 264,
    inrushPeakAmps: 15,
    inrushMs: 1,
    classes: [{ label: 'LED drop', count: 40, ratedVolts: 24, ratedAmps: 0.02, shunted: false }],
  },
]
