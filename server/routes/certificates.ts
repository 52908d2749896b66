import { office, safetyOfficers } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import {
  certificateBody,
  certificateCreated,
  certificateDocumentBody,
  certificateDocumentSaved,
  certificateList,
  certificateQuery,
  subjectList,
  subjectQuery,
} from '../../shared/schemas/certificates'
import { CERTIFICATE_DOCUMENT_FIELD, CERTIFICATE_DOCUMENT_MAX_MB } from '../../shared/vocab/certificates'
import { defineRoute, type RouteDef } from '../route-table'
import { listCertificates, recordCertificate } from '../services/certificates'
import { searchSubjects } from '../services/certificate-subjects'
import {
  assertCertificate,
  recordDocument,
  sendDocument,
  storeDocument,
} from '../services/certificate-documents'
import { certificateUpload } from '../middleware/certificate-upload'
import { audited } from '../services/audit'
import { badRequest } from '../errors'
import { nowOf } from '../deps'

export const certificateRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/certificates',
    access: office,
    tag: 'safety',
    summary: 'Latest certificate per subject and kind, filtered by due state',
    query: certificateQuery,
    response: certificateList,
    handler: async ({ deps, query }) => ({ items: await listCertificates(deps.db, query, nowOf(deps)) }),
  }),
  defineRoute({
    method: 'get',
    path: '/certificates/subjects',
    access: office,
    tag: 'safety',
    summary: 'Find a platform, structure, string or circuit by tag, reference or name (up to 20)',
    query: subjectQuery,
    response: subjectList,
    handler: async ({ deps, query }) => ({ items: await searchSubjects(deps.db, query) }),
  }),
  defineRoute({
    method: 'post',
    path: '/certificates',
    access: safetyOfficers,
    tag: 'safety',
    summary:
      'Record a test or inspection (the first for a subject, or a new one); readings decide RCD and insulation results; a failed test opens a queue item in the same commit',
    body: certificateBody,
    response: certificateCreated,
    status: 201,
    handler: ({ deps, body, user, req }) =>
      audited(
        deps.db,
        (trx) => recordCertificate(trx, user.id, body, nowOf(deps)),
        (c) => ({
          userId: user.id,
          action: 'certificate',
          entity: 'certificate',
          entityId: c.id,
          details: { kind: body.kind, result: c.result },
          requestId: String(req.id),
        }),
      ),
  }),
  defineRoute({
    method: 'post',
    path: '/certificates/:id/document',
    access: safetyOfficers,
    tag: 'safety',
    summary: `Attach the certificate's document (multipart field "${CERTIFICATE_DOCUMENT_FIELD}": PDF, JPEG or PNG by its bytes, ≤ ${CERTIFICATE_DOCUMENT_MAX_MB} MB); 415 unsupported_type, 413 too_large`,
    params: idParam,
    body: certificateDocumentBody,
    bodyType: 'multipart',
    response: certificateDocumentSaved,
    status: 201,
    before: () => [certificateUpload],
    handler: async ({ deps, params, user, req }) => {
      await assertCertificate(deps.db, params.id)
      const file = req.file
      if (!file)
        throw badRequest('no_file', `Send the document in the form field "${CERTIFICATE_DOCUMENT_FIELD}".`)
      const stored = await storeDocument(deps.files, params.id, file)
      return audited(
        deps.db,
        (trx) => recordDocument(trx, user.id, params.id, stored, file.size, nowOf(deps)),
        (d) => ({
          userId: user.id,
          action: 'attach_document',
          entity: 'certificate',
          entityId: params.id,
          details: { name: d.name, contentType: d.contentType, sizeBytes: d.sizeBytes },
          requestId: String(req.id),
        }),
      )
    },
  }),
  defineRoute({
    method: 'get',
    path: '/certificates/:id/document',
    access: office,
    tag: 'safety',
    summary: "The certificate's newest document (PDF, JPEG or PNG), for office staff only; 404 no_document",
    params: idParam,
    responseType: 'application/pdf',
    handler: ({ deps, params, res }) => sendDocument(deps.db, deps.files, params.id, res),
  }),
]
