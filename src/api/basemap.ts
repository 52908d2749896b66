import type { z } from 'zod'
import type { basemap } from '../../shared/schemas/system'
import { http } from './http'

export type Basemap = z.infer<typeof basemap>
export type BasemapFeature = Basemap['features'][number]

export const basemapApi = {
  /** The demo town's own streets; drawn only when the server has no tile source configured. */
  get: () => http.get<Basemap>('/basemap'),
}
