import type { z } from 'zod'
import type { ImportResult, RegisterFilters, RegisterSort, registerPage } from '../../shared/schemas/register'
import { API_BASE, http, request } from './http'

export type RegisterPage = z.infer<typeof registerPage>
export type RegisterRow = RegisterPage['items'][number]
export type { ImportResult, RegisterSort }
/** The filters the register takes; absent means "any". */
export type RegisterQuery = RegisterFilters
export type FileFormat = 'csv' | 'xlsx'

export interface PageRequest {
  page: number
  pageSize: number
  sort: RegisterSort
  dir: 'asc' | 'desc'
}

function url(path: string, query: Record<string, string | number | undefined>): string {
  const params = new URLSearchParams()
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== '') params.set(k, String(v))
  return `${API_BASE}${path}?${params}`
}

export const registerApi = {
  list: (query: RegisterQuery & PageRequest, signal?: AbortSignal) =>
    http.get<RegisterPage>('/register', { ...query }, signal),
  /** A download link (the session cookie goes with it): the register with these filters and sort. */
  exportUrl: (format: FileFormat, query: RegisterQuery & Partial<Pick<PageRequest, 'sort' | 'dir'>>) =>
    url('/register/export', { format, ...query }),
  templateUrl: (format: FileFormat) => url('/register/template', { format }),
  /** Sends a file; `onProgress` follows the upload (0 to 1), then the server reads and checks it. */
  import: (
    file: File,
    options: { dryRun: boolean; mode: 'upsert' | 'strict' },
    onProgress?: (fraction: number) => void,
  ) => {
    const form = new FormData()
    form.set('dryRun', String(options.dryRun))
    form.set('mode', options.mode)
    form.set('file', file)
    return request<ImportResult>('POST', '/register/import', {
      body: form,
      onUploadProgress: onProgress,
      timeoutMs: 120_000,
    })
  },
}
