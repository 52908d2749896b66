import {
  eraseEmailBody,
  eraseEmailResult,
  refParam,
  reportBody,
  reportCreated,
  reportStatus,
  streetList,
} from '../../shared/schemas/reports'
import { reportPhotoBody, reportPhotoResult } from '../../shared/schemas/report-work'
import { idParam } from '../../shared/schemas/common'
import { everyone } from '../../shared/roles'
import { memoryUpload } from '../middleware/upload'
import { saveReportPhoto, sendReportPhoto } from '../services/report-photos'
import { defineRoute, type RouteDef } from '../route-table'
import { createReport, listStreets, reportStatus as loadStatus } from '../services/reports'
import { eraseReporterEmail } from '../services/report-guards'
import { LIMITS, limitByAddress } from '../services/rate-limits'
import { nowOf } from '../deps'
import { logger } from '../logger'

// The public form and the status look-up need no account, so both are limited per address.
export const reportRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/reports',
    access: 'public',
    tag: 'public',
    summary:
      'Report a fault without an account; a repeated Idempotency-Key answers 200 with the first report. ' +
      'An address given gets an acknowledgement with a status link. The answer carries a one-time photoKey ' +
      'for POST /reports/{ref}/photo',
    // Optional: the public form sends one made when it opens; other senders may leave it out.
    idempotency: 'optional',
    body: reportBody,
    response: reportCreated,
    status: 201,
    before: (deps) => [limitByAddress(deps.db, LIMITS.report)],
    handler: async ({ deps, body, req, res, idempotencyKey }) => {
      const { created, report, mailId } = await createReport(
        deps.db,
        deps.config,
        body,
        req.ip ?? '',
        idempotencyKey,
        nowOf(deps),
      )
      // The acknowledgement is in the outbox with the report; its first attempt is made after the answer.
      if (mailId)
        deps.mailer
          .deliverDue?.({ ids: [mailId] })
          .catch((err: unknown) => logger.error({ err, mailId }, 'report mail: first attempt failed'))
      if (!created) res.status(200)
      return report
    },
  }),
  defineRoute({
    method: 'get',
    path: '/reports/:ref',
    access: 'public',
    tag: 'public',
    summary: 'Status of a public report by its reference, with its history; nothing personal',
    params: refParam,
    response: reportStatus,
    before: (deps) => [limitByAddress(deps.db, LIMITS.statusLookup)],
    handler: ({ deps, params }) => loadStatus(deps.db, params.ref),
  }),
  defineRoute({
    method: 'post',
    path: '/reports/:ref/erase-email',
    access: 'public',
    tag: 'public',
    summary: 'Erase the e-mail address given with a report, with the token from a link in its e-mail',
    params: refParam,
    body: eraseEmailBody,
    response: eraseEmailResult,
    before: (deps) => [limitByAddress(deps.db, LIMITS.statusLookup)],
    handler: ({ deps, params, body }) =>
      deps.db.transaction((trx) => eraseReporterEmail(trx, params.ref, body.token)),
  }),
  defineRoute({
    method: 'post',
    path: '/reports/:ref/photo',
    access: 'public',
    tag: 'public',
    summary:
      'Send the one photo a report may carry (multipart: field "photo", JPEG, PNG or WebP, and the ' +
      'photoKey its answer gave); checked by its bytes like field photos; a repeat answers 200',
    params: refParam,
    body: reportPhotoBody,
    bodyType: 'multipart',
    response: reportPhotoResult,
    status: 201,
    // A photo counts as a report against the sender's limit.
    before: (deps) => [limitByAddress(deps.db, LIMITS.report), memoryUpload(deps.config, 'photo', 1)],
    handler: async ({ deps, params, body, req, res }) => {
      const files = Array.isArray(req.files) ? req.files : []
      const { created, result } = await saveReportPhoto(
        deps.db,
        deps.files,
        params.ref,
        body.photoKey,
        files[0],
      )
      if (!created) res.status(200)
      return result
    },
  }),
  ...(['file', 'thumb'] as const).map((kind) =>
    defineRoute({
      method: 'get',
      path: `/report-photos/:id/${kind}`,
      access: everyone,
      tag: 'queue',
      summary: `A public report's photo${kind === 'thumb' ? ' thumbnail (320 px)' : ''}, for signed-in staff only. Served as image/jpeg, cached privately`,
      params: idParam,
      responseType: 'image/jpeg',
      handler: ({ deps, params, res }) => sendReportPhoto(deps.db, deps.files, params.id, kind, res),
    }),
  ),
  defineRoute({
    method: 'get',
    path: '/public/streets',
    access: 'public',
    tag: 'public',
    summary: 'Streets and venues with our lights, for the report form',
    response: streetList,
    handler: async ({ deps }) => ({ items: await listStreets(deps.db) }),
  }),
]
