// Shapes shared by the test-reading rules (test-limits.ts, insulation-limits.ts).

export type RcdType = 'general' | 'S'

/** Readings of a test as stored on a certificate; every field optional (older rows lack the newer ones). */
export interface Readings {
  /** RCD rated residual current IΔn, mA. */
  ratedMa?: number
  /** `general` (no intentional delay) or `S` (time-delayed); absent on older rows = general. */
  rcdType?: RcdType
  /** ½ × IΔn test: true = held (did not trip, as it must), false = tripped; absent = not tested. */
  noTripAtHalf?: boolean
  tripMsAt1x?: number
  tripMsAt2x?: number
  tripMsAt5x?: number
  /** Standing leakage (protective-conductor current) measured on the circuit with its load on, mA. */
  leakageMa?: number
  /** Insulation test voltage, V DC. */
  testVolts?: number
  megohms?: number
  /** Nominal voltage of the circuit tested, V AC: decides the insulation minimum. */
  circuitVolts?: number
  proofLoadKn?: number
  safeWorkingLoadKg?: number
}

export type FindingCode =
  | 'rcd_slow'
  | 'rcd_too_fast'
  | 'rcd_tripped_at_half'
  | 'no_additional_protection'
  | 'leakage_high'
  | 'insulation_low'
  | 'insulation_test_volts_low'
  | 'circuit_volts_assumed'

/** fail decides a fail; advisory makes a pass advisory; note changes nothing. */
export interface Finding {
  code: FindingCode
  level: 'fail' | 'advisory' | 'note'
  text: string
}

export interface Judged {
  result: 'pass' | 'fail' | 'advisory'
  findings: Finding[]
  /** The findings' texts, in order. */
  reasons: string[]
}
