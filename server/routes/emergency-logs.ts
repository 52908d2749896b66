import { keyedAnswer } from './keyed-answer'
import { idParam } from '../../shared/schemas/common'
import {
  emergencyLog,
  emergencyLogBody,
  emergencyPhotoBody,
  stringWorkNotes,
} from '../../shared/schemas/report-work'
import { everyone, fieldWorkers } from '../../shared/roles'
import { defineRoute, type RouteDef } from '../route-table'
import { memoryUpload } from '../middleware/upload'
import { forbidden } from '../errors'
import {
  attachEmergencyPhoto,
  emergencyLogById,
  emergencyLogRow,
  emergencyLogsOfString,
  logEmergency,
} from '../services/emergency-logs'
import { removeStored, sendStored, storeOnePhoto } from '../services/report-photos'
import { reportNotesForString } from '../services/report-notes'

const cacheNote = 'Served as image/jpeg with Cache-Control: private, max-age=86400.'

// The crew's log of an emergency stop, its photo, and what a string's page shows of public work.
export const emergencyLogRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/queue/:id/emergency-log',
    access: fieldWorkers,
    tag: 'field',
    summary:
      'Log an emergency (hazard report) stop: what was found, what was done, whether it is made safe. ' +
      '"fixed" closes the item and its reports read Fixed; a repeated Idempotency-Key answers 200 with the first log',
    idempotency: 'required',
    params: idParam,
    body: emergencyLogBody,
    response: emergencyLog,
    status: 201,
    handler: async ({ deps, req, res, params, body, user, idempotencyKey }) => {
      const by = { id: user.id, requestId: String(req.id) }
      return keyedAnswer(res, logEmergency(deps.db, params.id, by, body, idempotencyKey))
    },
  }),
  defineRoute({
    method: 'post',
    path: '/emergency-logs/:id/photo',
    access: fieldWorkers,
    tag: 'field',
    summary:
      'Attach one photo to an emergency log (multipart field "photo"; JPEG, PNG or WebP); a second answers 200',
    idempotency: 'optional',
    params: idParam,
    body: emergencyPhotoBody,
    bodyType: 'multipart',
    response: emergencyLog,
    status: 201,
    before: (deps) => [memoryUpload(deps.config, 'photo', 1)],
    handler: async ({ deps, req, res, params, user }) => {
      const row = await emergencyLogRow(deps.db, params.id)
      if (row.userId !== user.id && user.role !== 'supervisor')
        throw forbidden('Only the log’s author or a supervisor may add its photo.')
      if (row.photoFile) {
        res.status(200)
        return emergencyLogById(deps.db, params.id)
      }
      const files = Array.isArray(req.files) ? req.files : []
      const stored = await storeOnePhoto(deps.files, files[0])
      const attached = await attachEmergencyPhoto(deps.db, params.id, {
        photoFile: stored.fileName,
        photoThumb: stored.thumbName,
      }).catch(async (err: unknown) => {
        await removeStored(deps.files, stored)
        throw err
      })
      if (!attached) {
        await removeStored(deps.files, stored)
        res.status(200)
      }
      return emergencyLogById(deps.db, params.id)
    },
  }),
  ...(['file', 'thumb'] as const).map((kind) =>
    defineRoute({
      method: 'get',
      path: `/emergency-logs/:id/photo/${kind}`,
      access: everyone,
      tag: 'field',
      summary: `An emergency log's photo${kind === 'thumb' ? ' thumbnail (320 px)' : ''}. ${cacheNote}`,
      params: idParam,
      responseType: 'image/jpeg',
      handler: async ({ deps, params, res }) => {
        const row = await emergencyLogRow(deps.db, params.id)
        return sendStored(deps.files, kind === 'file' ? row.photoFile : row.photoThumb, res)
      },
    }),
  ),
  defineRoute({
    method: 'get',
    path: '/strings/:id/work-notes',
    access: everyone,
    tag: 'field',
    summary:
      'Public reports still waiting on a string (their words, place and photo; nothing personal) and its emergency logs',
    params: idParam,
    response: stringWorkNotes,
    handler: async ({ deps, params }) => ({
      reports: await reportNotesForString(deps.db, params.id),
      emergencyLogs: await emergencyLogsOfString(deps.db, params.id),
    }),
  }),
]
