// Switching schedules: burning hours a night from switch-on and switch-off times (HH:mm).
export function minutesOfDay(hhmm: string): number {
  const [h, m] = hhmm.split(':').map(Number)
  return h * 60 + m
}

/** Hours the lights burn each night; a switch-off past midnight wraps to the next day. */
export function burnHoursPerDay(switchOn: string, switchOff: string): number {
  const on = minutesOfDay(switchOn)
  const off = minutesOfDay(switchOff)
  const minutes = off > on ? off - on : 24 * 60 - on + off
  return minutes / 60
}

export function hhmm(minutes: number): string {
  const m = ((Math.round(minutes) % 1440) + 1440) % 1440
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`
}

/** Nights the lights burn in a season, counting both the switch-on and the last night (dates YYYY-MM-DD). */
export function seasonNights(start: string | null, end: string | null): number | null {
  if (!start || !end) return null
  return Math.max(0, Math.round((Date.parse(end) - Date.parse(start)) / 86_400_000) + 1)
}
