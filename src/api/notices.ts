import type { Notice, NoticesPage, NoticesReadResponse } from '../../shared/schemas/notices'
import { http } from './http'

export type { Notice, NoticesPage }

export const noticesApi = {
  list: (page = 1, pageSize?: number) => http.get<NoticesPage>('/notices', { page, pageSize }),
  markRead: (ids: number[]) => http.post<NoticesReadResponse>('/notices/read', { ids }),
  markAllRead: () => http.post<NoticesReadResponse>('/notices/read', { all: true }),
}
