import type { z } from 'zod'
import type { overdueReport } from '../../shared/schemas/overdue'
import { http } from './http'

export { queueKindLabel } from '../../shared/vocab/queue'

export type OverdueReport = z.infer<typeof overdueReport>
export type OverdueClient = OverdueReport['clients'][number]
export type OverdueItem = OverdueClient['items'][number]

export const overdueApi = {
  get: () => http.get<OverdueReport>('/overdue'),
}
