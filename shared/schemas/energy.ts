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
