// The estate's records (clients, sites, … platforms): paged lists, one row with its version,
// create, change (with the version loaded) and archive.
import type { EstateKind } from '../../shared/schemas/estate'
import { http } from './http'

export type { EstateKind }

/** A stored row as the server answers it; fields depend on the kind. */
export type EstateRow = Record<string, unknown> & { id: number; version: number; archivedAt: string | null }

export interface EstatePage {
  items: EstateRow[]
  total: number
}

export interface EstateListQuery {
  page: number
  pageSize: number
  q?: string
  archived?: 'false' | 'true' | 'only'
}

export const estateApi = {
  list: (kind: EstateKind, query: EstateListQuery) =>
    http.get<EstatePage>(`/${kind}`, { ...query, q: query.q || undefined }),
  get: (kind: EstateKind, id: number) => http.get<EstateRow>(`/${kind}/${id}`),
  create: (kind: EstateKind, body: Record<string, unknown>) => http.post<EstateRow>(`/${kind}`, body),
  update: (kind: EstateKind, id: number, body: Record<string, unknown>) =>
    http.patch<EstateRow>(`/${kind}/${id}`, body),
  archive: (kind: EstateKind, id: number) => http.delete<EstateRow>(`/${kind}/${id}`),
}

export interface CrewCandidate {
  id: number
  name: string
  role: 'crew' | 'supervisor'
  crewId: number | null
  crewName: string | null
}

export const crewCandidatesApi = {
  list: () => http.get<{ items: CrewCandidate[] }>('/crew-members'),
}
