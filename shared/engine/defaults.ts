// Every default the engine applies, in one place, with where it comes from. The zod schemas in
// shared/schemas/engine.ts use the same constants so API docs and engine agree.

// Life ∝ r^−d with d = 12–16 (Wikipedia "Lamp rerating", citing Fink & Beaty 1978; Lumitron
// "Lamp terminology" uses 12). 13 sits with the IES Lighting Handbook's ≈ 13.1 for gas-filled
// lamps (memory, not checked against the original).
export const DEFAULT_LIFE_EXPONENT = 13

// 5 % over-voltage roughly halves life (Lamptech; Hella "Maximising bulb life"): the point where a
// string moves from Watch to Replace now unless the client sets otherwise.
export const DEFAULT_REPLACE_AT_RATIO = 1.05

// Weibull shape of filament lamp life: the ReliaWiki "Life of incandescent light bulbs" 10-lamp
// sample fits 2.5–3.1 (rank regression / maximum likelihood); 2.8 is the middle of that range.
export const DEFAULT_WEIBULL_SHAPE = 2.8

// Chance that a failing lamp's shunt opens instead of closing: common practice, no source.
export const DEFAULT_SHUNT_FAIL_PROBABILITY = 0.02

// Lights run about 5–9 h a night and the season runs late November to about 6 January
// (trade-reference §1, common practice).
export const DEFAULT_BURN_HOURS_PER_DAY = 7
export const DEFAULT_SEASON_DAYS = 42

export const DEFAULT_TRIALS = 2000
export const MAX_TRIALS = 20000
export const DEFAULT_SEED = 1

// Simulation horizon: 20 years of continuous burning. A string not dark by then counts as
// "not dark" rather than stretching the run forever.
export const HORIZON_HOURS = 20 * 365 * 24

// The burning hours at which the forecast reports the chance of being dark: one night-ish, three
// days, a week of continuous burning.
export const P_DARK_HOURS = [24, 72, 168]

// Filament operating temperature at rated voltage; the hot/cold resistance ratio there is ≈ 15,
// matching "cold ≈ 1/15 of hot" (Wikipedia "Incandescent light bulb"; trade-reference §4).
export const DEFAULT_OPERATING_KELVIN = 2800

// Clamp-meter accuracy assumed when estimating shorted lamps: ±2 % current, ±1 % volts. Typical
// of a trade clamp meter's AC ranges (common practice, no source): set from the meter's data sheet.
export const DEFAULT_CURRENT_TOLERANCE = 0.02
export const DEFAULT_VOLTS_TOLERANCE = 0.01

// LED strings draw a short driver inrush; without the maker's figure assume twice running current
// (assumption, no source: set per product from the data sheet).
export const DEFAULT_LED_INRUSH_MULTIPLE = 2

// Continuous load kept to 80 % of the breaker rating (common practice; NEC 210.21(B)(2) applies the
// same 80 % to cord-and-plug loads on a 15 A receptacle).
export const CONTINUOUS_LOAD_FRACTION = 0.8

// Largest forecast run on request, in lamp-trials (trials × lamps in circuit); larger ones are refused
// before any work starts. Its worst case (50 classes of mixed ratings, no shunt ever opening) runs
// about 1 s on one core; 2,000 lamps × 2,000 trials, twice this, stalled the server for 2 s while
// forecasts still ran on the event loop (measured here; common practice, no source).
export const MAX_FORECAST_COST = 2_000_000

/** A forecast's cost in lamp-trials: the lamps still in circuit times the trials asked for. */
export function forecastCost(input: { trials?: number; lamps: { count: number; failed?: number }[] }): {
  lamps: number
  trials: number
  cost: number
} {
  const lamps = input.lamps.reduce((n, c) => n + Math.max(0, c.count - Math.min(c.failed ?? 0, c.count)), 0)
  const trials = input.trials ?? DEFAULT_TRIALS
  return { lamps, trials, cost: lamps * trials }
}
