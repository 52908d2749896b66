import { API_PREFIX } from '../openapi'

export const photoUrls = (id: number) => ({
  url: `${API_PREFIX}/photos/${id}/file`,
  thumbUrl: `${API_PREFIX}/photos/${id}/thumb`,
})
