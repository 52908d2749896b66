import { idParam } from '../../shared/schemas/common'
import { photoList, photoUploadBody } from '../../shared/schemas/photos'
import { everyone, fieldWorkers } from '../../shared/roles'
import { defineRoute, type RouteDef } from '../route-table'
import { memoryUpload } from '../middleware/upload'
import { listPhotos, savePhotos, sendPhoto } from '../services/photos'

const cacheNote = 'Served as image/jpeg with Cache-Control: private, max-age=86400.'

export const photoRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/visits/:id/photos',
    access: fieldWorkers,
    tag: 'field',
    summary:
      'Attach photos to a visit (multipart field "photo", up to 8; JPEG, PNG or WebP); a repeated Idempotency-Key answers 200 with the first upload',
    // Optional: the phone's outbox always sends one, so a repeated upload is not stored twice.
    idempotency: 'optional',
    params: idParam,
    body: photoUploadBody,
    bodyType: 'multipart',
    response: photoList,
    status: 201,
    before: (deps) => [memoryUpload(deps.config)],
    handler: async ({ req, res, params, user, deps, idempotencyKey }) => {
      const files = Array.isArray(req.files) ? req.files : []
      const { created, items } = await savePhotos(deps.db, deps.files, params.id, user, files, idempotencyKey)
      if (!created) res.status(200)
      return { items }
    },
  }),
  defineRoute({
    method: 'get',
    path: '/visits/:id/photos',
    access: everyone,
    tag: 'field',
    summary: 'Photos of a visit',
    params: idParam,
    response: photoList,
    handler: async ({ params, deps }) => ({ items: await listPhotos(deps.db, params.id) }),
  }),
  defineRoute({
    method: 'get',
    path: '/photos/:id/file',
    access: everyone,
    tag: 'field',
    summary: `A photo (at most 2048 px). ${cacheNote}`,
    params: idParam,
    responseType: 'image/jpeg',
    handler: ({ params, deps, res }) => sendPhoto(deps.db, deps.files, params.id, 'file', res),
  }),
  defineRoute({
    method: 'get',
    path: '/photos/:id/thumb',
    access: everyone,
    tag: 'field',
    summary: `A photo's thumbnail (320 px). ${cacheNote}`,
    params: idParam,
    responseType: 'image/jpeg',
    handler: ({ params, deps, res }) => sendPhoto(deps.db, deps.files, params.id, 'thumb', res),
  }),
]
