// Every default the engine applies, in one place, with where it comes from. The zod schemas in
// shared/schemas/engine.ts use the same constants so API docs and engine agree.

// Life ∝ r^−d with d = 12–16 (Wikipedia "Lamp rerating", citing Fink & Beaty 1978; Lumitron
// "Lamp terminology" uses 12). 13 sits with the IES Lighting Handbook's ≈ 13.1 for gas-filled
// lamps (memory, not checked against the original).
export const DEFAULT_LIFE_EXPONENT = 13

// 5 % over-voltage roughly halves life (Lamptech; Hella "Maximising bulb life"): the point where a
// string moves from Watch to Replace now unless the client sets otherwise.
export const DEFAULT_REPLACE_AT_RATIO = 1.05

// Replace now by risk: a string is also flagged when the forecast gives more than this chance of it
// going dark before its next planned patrol (or within the client's standard response time). Our
// judgement, no source: a type may set its own (string_types.replace_risk).
export const DEFAULT_REPLACE_RISK = 0.2

// Weibull shape of filament lamp life: the ReliaWiki "Life of incandescent light bulbs" 10-lamp
// sample fits 2.5–3.1 (rank regression / maximum likelihood); 2.8 is the middle of that range.
export const DEFAULT_WEIBULL_SHAPE = 2.8

// Chance that a failing lamp's shunt opens instead of closing: common practice, no source.
export const DEFAULT_SHUNT_FAIL_PROBABILITY = 0.02

// A fuse lamp's life settings (a lamp class's `lifeExponent`, `ratedLifeHours`). It has no shunt and
// is meant to fail first under over-stress and put the string out before the rest burn up
// (trade-reference §2a). Its ratio is the same as its neighbours' when it shares their rated current
// (the series solve), so what makes it go first is a life that falls faster with over-voltage: the
// exponent 16, the top of the published 12–16 range (Wikipedia "Lamp rerating"; our choice within it,
// no source for fuse lamps). Its rated life stays the type's (no source for a shorter one).
export const FUSE_LAMP_LIFE_EXPONENT = 16

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
// Most hours a forecast request may add of its own (`pDarkAt`, e.g. the next patrol).
export const MAX_P_DARK_AT = 8

// Filament operating temperature at rated voltage; the hot/cold resistance ratio there is ≈ 15,
// matching "cold ≈ 1/15 of hot" (Wikipedia "Incandescent light bulb"; trade-reference §4).
export const DEFAULT_OPERATING_KELVIN = 2800

// Clamp-meter accuracy assumed when estimating shorted lamps: ±2 % of reading on current (the
// ± (2 % + 2) example of Fluke's "Clamp Meter ABCs" application note; common practice), ±1 % on the
// supply volts (common practice, no source), one digit of 0.01 A (the smallest step of the lowest
// AC range of common trade clamp meters: common practice, no source). Set all three from the meter.
export const DEFAULT_CURRENT_TOLERANCE = 0.02
export const DEFAULT_VOLTS_TOLERANCE = 0.01
export const DEFAULT_METER_RESOLUTION_AMPS = 0.01

// A lamp's current at rated voltage may differ from its stated amps by ±10 % (Lumitron "Lamp
// terminology": stated amperage ratings are plus or minus 10 percent). Applied to the whole string as
// a worst case: lamps of one batch tend to be off the same way (assumption). A healthy string's own
// reading (a reference) replaces it.
export const DEFAULT_LAMP_CURRENT_TOLERANCE = 0.1

// Cold resistance. Small series lamps measure about 11 × colder than hot (3.4 kΩ hot, 310 Ω cold on
// a 20-lamp string: trade-reference §2a, bench measurement, common practice); the published ≈ 15 is
// for larger lamps running hotter. ±10 % on that ratio (assumption: one bench string, no source).
export const DEFAULT_HOT_COLD_RATIO = 11
export const DEFAULT_HOT_COLD_RATIO_TOLERANCE = 0.1
// A handheld meter's ohms ranges are specified near ±1 % of reading plus a few digits (e.g. 400 Ω
// range ±(0.8 % + 5 digits) in one maker's manual; common practice).
export const DEFAULT_OHMMETER_ACCURACY = 0.01
// Two healthy strings of one type differ by a few percent in resistance (assumption, no source: set
// from your own readings of healthy strings).
export const DEFAULT_STRING_SPREAD = 0.03

// Where the filament lamp laws (I ∝ r^0.55, P ∝ r^1.6, light ∝ r^3.4, life ∝ r^−d) are trusted.
// Wikipedia "Lamp rerating" (Fink & Beaty 1978) states no range and calls the exponents estimates;
// Lamptech "Voltage variation effects" gives its figures "within the normal range of supply voltage
// variations". 50 %–140 % of rated voltage is our conservative choice (memory / common practice, no
// source): at 140 % life is under 2 % of rated (d = 13), below 50 % light is under 10 %. Outside it
// the engine gives a plain verdict and no extrapolated amps, watts, light or life figures.
export const LAWS_MIN_RATIO = 0.5
export const LAWS_MAX_RATIO = 1.4

// An LED driver's input range when the type gives none: nominal ±10 %, the supply tolerance of
// EN 50160 (230 V ± 10 % for 95 % of 10-minute means; also IEC 60038), which mains equipment is built
// to work across (EN 50160 as summarised by electrical-contractor.net; the standard itself not read).
export const DEFAULT_DRIVER_TOLERANCE = 0.1

// LED power factor when the type gives none: 1, so watts = V × A, an upper bound (W ≤ VA by the
// definition of power factor). Real drivers are lower: EU 2019/2020 only asks a displacement factor
// of ≥ 0.5 (5–10 W), ≥ 0.7 (10–25 W), ≥ 0.9 (above 25 W) of LED light sources (via hzymtech's
// summary of Annex II). Set it from the data sheet.
export const DEFAULT_LED_POWER_FACTOR = 1

// Continuous load kept to 80 % of the breaker rating (common practice; NEC 210.21(B)(2) applies the
// same 80 % to cord-and-plug loads on a 15 A receptacle).
export const CONTINUOUS_LOAD_FRACTION = 0.8

// Largest forecast run on request, in lamp-trials (trials × lamps in circuit); larger ones are refused
// before any work starts. Its worst case (50 classes of mixed ratings, no shunt ever opening) runs
// about 1 s on one core; 2,000 lamps × 2,000 trials, twice this, stalled the server for 2 s while
// forecasts still ran on the event loop (measured here; common practice, no source).
export const MAX_FORECAST_COST = 2_000_000

/** A forecast's cost in lamp-trials: the lamps still in circuit (every chain) times the trials asked for. */
export function forecastCost(input: {
  trials?: number
  branches?: number
  lamps: { count: number; failed?: number; opened?: number; removed?: number }[]
}): {
  lamps: number
  trials: number
  cost: number
} {
  const m = Math.max(1, input.branches ?? 1)
  const out = (c: { failed?: number; opened?: number; removed?: number }) =>
    (c.failed ?? 0) + (c.opened ?? 0) + (c.removed ?? 0)
  const lamps = input.lamps.reduce((n, c) => n + Math.max(0, c.count * m - out(c)), 0)
  const trials = input.trials ?? DEFAULT_TRIALS
  return { lamps, trials, cost: lamps * trials }
}
