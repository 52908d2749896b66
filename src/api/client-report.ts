import type { ClientReport } from '../../shared/schemas/client-report'
import { http } from './http'

export type { ClientReport }

export const clientReportApi = {
  get: (clientId: number, from?: string, to?: string) =>
    http.get<ClientReport>('/client-report', { clientId, from, to }),
  /** Clients with their contract, from the overdue report every manager can read. */
  clients: async () =>
    (await http.get<{ clients: { id: number; name: string }[] }>('/overdue')).clients.map(({ id, name }) => ({
      id,
      name,
    })),
}
