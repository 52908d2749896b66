import { z } from 'zod'

const use = {
  watts: z.number(),
  kwhPerNight: z.number(),
  kwhPerSeason: z.number(),
  costPerNight: z.number().nullable(),
  costPerSeason: z.number().nullable(),
}

export const energyReport = z.object({
  generatedAt: z.string(),
  clients: z.array(
    z.object({
      id: z.number(),
      name: z.string(),
      tariffPerKwh: z.number(),
      switchOn: z.string(),
      switchOff: z.string(),
      burnHoursPerDay: z.number(),
      seasonStart: z.string().nullable(),
      seasonEnd: z.string().nullable(),
      seasonDays: z.number(),
      strings: z.number(),
      ...use,
      sites: z.array(z.object({ id: z.number(), name: z.string(), strings: z.number(), ...use })),
      types: z.array(
        z.object({ code: z.string(), name: z.string(), technology: z.string(), strings: z.number(), ...use }),
      ),
    }),
  ),
})
export type EnergyReport = z.infer<typeof energyReport>

// LED what-if (GET /energy/led-what-if): the client's filament strings swapped one for one for healthy
// strings of a chosen LED type, a season side by side with today's. Energy counts real power (W =
// V × A × power factor), not the volt-amps a driver draws.
export const ledWhatIfQuery = z.object({
  clientId: z.coerce.number().int().positive(),
  /** An LED string type; without it the first LED type by code. */
  typeId: z.coerce.number().int().positive().optional(),
})
export type LedWhatIfQuery = z.infer<typeof ledWhatIfQuery>

const useObject = z.object(use)
export const ledWhatIf = z.object({
  clientId: z.number(),
  clientName: z.string(),
  tariffPerKwh: z.number(),
  burnHoursPerDay: z.number(),
  seasonDays: z.number(),
  /** LED types to choose from; empty when the catalogue has none. */
  ledTypes: z.array(z.object({ id: z.number(), code: z.string(), name: z.string() })),
  /** The type compared; null when there is no LED type. */
  type: z
    .object({
      id: z.number(),
      code: z.string(),
      name: z.string(),
      /** One healthy string of this type: volts × amps (what the circuit carries) and watts (what is billed). */
      voltAmps: z.number(),
      watts: z.number(),
    })
    .nullable(),
  /** Filament strings compared (isolated ones count as off on both sides). */
  strings: z.number(),
  isolated: z.number(),
  /** LED strings the client already has, unchanged and outside both columns. */
  ledStringsAlready: z.number(),
  today: useObject,
  relamped: useObject,
  byType: z.array(
    z.object({
      code: z.string(),
      name: z.string(),
      strings: z.number(),
      today: useObject,
      relamped: useObject,
    }),
  ),
})
export type LedWhatIf = z.infer<typeof ledWhatIf>
