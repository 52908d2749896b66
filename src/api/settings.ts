import type { z } from 'zod'
import type {
  stringTypePatch,
  stringTypeRow,
  stringTypeUpdated,
  systemSettings,
} from '../../shared/schemas/types'
import { http } from './http'

export type StringTypeRow = z.infer<typeof stringTypeRow>
export type StringTypePatch = z.input<typeof stringTypePatch>
export type SystemSettings = z.infer<typeof systemSettings>

export const settingsApi = {
  types: () => http.get<{ items: StringTypeRow[] }>('/string-types'),
  updateType: (id: number, patch: StringTypePatch) =>
    http.patch<z.infer<typeof stringTypeUpdated>>(`/string-types/${id}`, patch),
  system: () => http.get<SystemSettings>('/settings/system'),
}
