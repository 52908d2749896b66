export interface EnergyUse {
  watts: number
  kwhPerNight: number
  kwhPerSeason: number
  costPerNight: number | null
  costPerSeason: number | null
}

// Energy is watts × burning hours; cost only when a tariff (per kWh) is known.
export function energyUse(
  watts: number,
  burnHoursPerDay: number,
  seasonDays: number,
  tariffPerKwh?: number,
): EnergyUse {
  const kwhPerNight = (watts * burnHoursPerDay) / 1000
  const kwhPerSeason = kwhPerNight * seasonDays
  const priced = tariffPerKwh !== undefined
  return {
    watts,
    kwhPerNight,
    kwhPerSeason,
    costPerNight: priced ? kwhPerNight * tariffPerKwh : null,
    costPerSeason: priced ? kwhPerSeason * tariffPerKwh : null,
  }
}
