import { z } from 'zod'
import { statusSchema } from './string-states'

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

export const registerQuery = z.object({
  q: z.string().trim().max(80).optional(),
  siteId: z.coerce.number().int().positive().optional(),
  typeId: z.coerce.number().int().positive().optional(),
  status: statusSchema.optional(),
})
export const registerList = z.object({
  items: z.array(
    z.object({
      id: z.number(),
      assetTag: z.string(),
      name: z.string(),
      status: statusSchema,
      lampsOut: z.number(),
      typeCode: z.string(),
      typeName: z.string(),
      technology: z.string(),
      siteId: z.number(),
      siteName: z.string(),
      clientName: z.string(),
      circuitRef: z.string().nullable(),
      structureRef: z.string().nullable(),
      installedOn: z.string().nullable(),
      lastVisitAt: z.string().nullable(),
      forecastDarkAt: z.string().nullable(),
      lat: z.number(),
      lng: z.number(),
    }),
  ),
  sites: z.array(z.object({ id: z.number(), name: z.string() })),
  types: z.array(z.object({ id: z.number(), code: z.string(), name: z.string() })),
})
