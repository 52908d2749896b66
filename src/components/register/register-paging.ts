import type { PageRequest, RegisterSort } from '../../api/register'

/** The register table's paging as q-table holds it; rowsNumber is the total over all pages. */
export interface RegisterPagination {
  page: number
  rowsPerPage: number
  sortBy: RegisterSort
  descending: boolean
  rowsNumber: number
}

export const firstPage = (): RegisterPagination => ({
  page: 1,
  rowsPerPage: 50,
  sortBy: 'assetTag',
  descending: false,
  rowsNumber: 0,
})

/** What the API is asked for this table state. */
export function pageRequest(p: RegisterPagination): PageRequest {
  return { page: p.page, pageSize: p.rowsPerPage, sort: p.sortBy, dir: p.descending ? 'desc' : 'asc' }
}
