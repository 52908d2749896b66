import type { EnergyReport, LedWhatIf } from '../../shared/schemas/energy'
import { http } from './http'

export type { EnergyReport, LedWhatIf }
export type EnergyClient = EnergyReport['clients'][number]
export type EnergySite = EnergyClient['sites'][number]
export type EnergyType = EnergyClient['types'][number]
/** One line of a per-site or per-type breakdown: what both share. */
export type EnergyLine = Pick<
  EnergySite,
  'strings' | 'watts' | 'kwhPerNight' | 'kwhPerSeason' | 'costPerNight' | 'costPerSeason'
> & { key: string; name: string; note?: string }

export const energyApi = {
  get: () => http.get<EnergyReport>('/energy'),
  ledWhatIf: (clientId: number, typeId?: number) =>
    http.get<LedWhatIf>('/energy/led-what-if', typeId ? { clientId, typeId } : { clientId }),
}
