import type { ClientReport } from '../../shared/schemas/client-report'
import { API_BASE, http } from './http'

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

/** The PDF for the client, as a link the browser downloads (same-origin, with the session cookie). */
export function clientReportPdfUrl(clientId: number, from?: string, to?: string): string {
  const q = new URLSearchParams({ clientId: String(clientId) })
  if (from) q.set('from', from)
  if (to) q.set('to', to)
  return `${API_BASE}/client-report.pdf?${q}`
}
