// The engine's assessment as the string page and the visit preview read it. Reasons are
// `{ code, text }`; a string page saved on the phone by an older release may still hold plain
// sentences and lack volts, amps and watts per lamp, so those are filled in here. A figure the engine
// sends as null (outside the lamp laws, or not a filament figure) stays null: nothing is extrapolated.
import {
  ISOLATION_CAUTION,
  liveSocketCodes,
  type Reason,
  type ReasonCode,
} from '../../../shared/engine/reason-codes'

export interface ClassView {
  lampsInCircuit: number
  /** lamps lit: in circuit in a chain that is not dark */
  lampsLit: number
  voltsPerLamp: number
  ampsPerLamp: number | null
  wattsPerLamp: number | null
  ratio: number
  /** null where the lamp laws do not apply (no extrapolated life figure). */
  lifeFactor: number | null
}

export interface AssessmentView {
  lit: boolean
  state: string
  lawsApply: boolean
  stringVolts: number
  stringAmps: number | null
  stringWatts: number | null
  /** 1 for filament; an LED driver's from the type */
  powerFactor: number
  branches: number
  branchesDark: number
  maxRatio: number
  replaceNow: boolean
  reasons: Reason[]
  classes: ClassView[]
}

type RawReason = string | { code?: string; text?: string }

export function toReason(r: RawReason): Reason {
  if (typeof r === 'string') return { code: 'unknown' as ReasonCode, text: r }
  return { code: (r.code ?? 'unknown') as ReasonCode, text: r.text ?? '' }
}

export function isLiveSocket(r: Reason): boolean {
  return liveSocketCodes.includes(r.code)
}

/** A reason's words without the caution sentence, where the caution is shown on its own beside it. */
export function reasonText(r: Reason): string {
  return r.text.replace(ISOLATION_CAUTION, '').trim()
}

export { ISOLATION_CAUTION }

type Maybe = number | null | undefined
interface RawClass {
  lampsInCircuit: number
  lampsLit?: number
  voltsPerLamp: number
  ratio: number
  ampsPerLamp?: number | null
  wattsPerLamp?: number | null
  currentFactor?: Maybe
  lifeFactor?: Maybe
}
interface RawAssessment {
  lit: boolean
  state: string
  lawsApply?: boolean
  stringVolts?: number
  stringAmps: Maybe
  stringWatts: Maybe
  powerFactor?: number
  branches?: number
  branchesDark?: number
  maxRatio: number
  replaceNow: boolean
  reasons: RawReason[]
  classes: RawClass[]
}

/** `rated` gives each class's rated amps, for answers that predate amps per lamp. */
export function assessmentView(
  raw: unknown,
  supplyVolts: number,
  rated: { ratedAmps: number }[],
): AssessmentView {
  const a = raw as RawAssessment
  const lawsApply = a.lawsApply ?? true
  const classes = a.classes.map((c, i) => {
    // Only an answer from before amps per lamp existed lacks the field; then the old law applies.
    const amps =
      c.ampsPerLamp !== undefined
        ? c.ampsPerLamp
        : c.currentFactor == null
          ? null
          : (rated[i]?.ratedAmps ?? 0) * c.currentFactor
    const watts = c.wattsPerLamp !== undefined ? c.wattsPerLamp : amps === null ? null : c.voltsPerLamp * amps
    return {
      lampsInCircuit: c.lampsInCircuit,
      lampsLit: c.lampsLit ?? (a.lit ? c.lampsInCircuit : 0),
      voltsPerLamp: c.voltsPerLamp,
      ampsPerLamp: amps,
      wattsPerLamp: watts,
      ratio: c.ratio,
      lifeFactor: lawsApply ? (c.lifeFactor ?? null) : null,
    }
  })
  return {
    lit: a.lit,
    state: a.state,
    lawsApply,
    stringVolts: a.stringVolts ?? supplyVolts,
    stringAmps: a.stringAmps ?? null,
    stringWatts: a.stringWatts ?? null,
    powerFactor: a.powerFactor ?? 1,
    branches: a.branches ?? 1,
    branchesDark: a.branchesDark ?? 0,
    maxRatio: a.maxRatio,
    replaceNow: a.replaceNow,
    reasons: a.reasons.map(toReason),
    classes,
  }
}
