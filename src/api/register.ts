import type { z } from 'zod'
import type { registerList, registerQuery } from '../../shared/schemas/energy'
import { http } from './http'

export type RegisterList = z.infer<typeof registerList>
export type RegisterRow = RegisterList['items'][number]
/** The filters `registerQuery` accepts; absent means "any". */
export interface RegisterQuery {
  q?: string
  siteId?: number
  typeId?: number
  status?: z.infer<typeof registerQuery>['status']
}

export const registerApi = {
  list: (query: RegisterQuery = {}, signal?: AbortSignal) =>
    http.get<RegisterList>('/register', { ...query }, signal),
}
