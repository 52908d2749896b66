// Burning hours → calendar dates, given how many hours a night the lights burn (from the client's
// switching schedule). Night 0 is the start date; hours spent within a night land on that night.
export function burningHoursToDate(
  hours: number | null,
  startDate: string,
  burnHoursPerDay: number,
): string | null {
  if (hours === null || !Number.isFinite(hours) || !(burnHoursPerDay > 0)) return null
  const nights = Math.max(0, Math.ceil(hours / burnHoursPerDay) - 1)
  const [y, m, d] = startDate.split('-').map(Number)
  // UTC date arithmetic: calendar days, untouched by daylight-saving changes.
  return new Date(Date.UTC(y, m - 1, d + nights)).toISOString().slice(0, 10)
}

export function burningHoursToDates(
  hours: (number | null)[],
  startDate: string,
  burnHoursPerDay: number,
): (string | null)[] {
  return hours.map((h) => burningHoursToDate(h, startDate, burnHoursPerDay))
}
