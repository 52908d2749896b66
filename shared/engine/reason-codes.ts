// Stable codes for the engine's reasons (`reasons: [{ code, text }]`). The text may be reworded; the
// codes never change meaning, so the client can pick an icon or a caution by code.
export const reasonCodes = [
  'no_lamps_out', // healthy: every lamp in circuit at the stated stress
  'lamps_shorted', // series: failed lamps shunted, the rest carry their voltage
  'parallel_out', // parallel: failed lamps out, the rest unchanged
  'replace_ratio', // at or above the type's replace-now ratio because of failures
  'supply_high', // at or above the replace-now ratio with no failures to blame
  'replace_risk', // the forecast's chance of going dark before the next patrol is over the setting
  'mixed_rating', // a class of a different rated current runs far from its rating (wrong lamp fitted)
  'laws_exceeded_high', // beyond the lamp laws' range, above rating: lamps will blow
  'laws_exceeded_low', // beyond the lamp laws' range, below rating: little or no light
  'fuse_lamp_failed', // a fuse lamp has failed open: the string (or its chain) is dark
  'chain_open', // a failed lamp whose shunt did not close: its chain is dark
  'lamp_removed', // a lamp missing from its socket: its chain is dark
  'all_failed', // every lamp has failed
  'led_in_range', // LED driver within its input range: constant current, no stress from supply
  'led_out_of_range', // LED driver outside its input range
  'led_section_out', // an LED section has failed: that section is dark
  'bright_lamps', // lamps brighter than their neighbours: coils stuck together after a knock
] as const

export type ReasonCode = (typeof reasonCodes)[number]

export interface Reason {
  code: ReasonCode
  text: string
}

/**
 * Situations in which a lamp socket can carry the full supply voltage whatever the lamp's own rating
 * (trade-reference §2 and §2a): the reason's text carries the isolation caution and the client shows
 * the caution mark beside it.
 */
export const liveSocketCodes: readonly ReasonCode[] = [
  'fuse_lamp_failed',
  'chain_open',
  'lamp_removed',
  'bright_lamps',
]

export const ISOLATION_CAUTION =
  'Caution: a socket in this string can carry the full supply voltage whatever the lamp rating. ' +
  'Isolate and prove dead before touching any lamp, following local codes and licensed practice.'
