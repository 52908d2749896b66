// A certificate's document, held in memory (at most CERTIFICATE_DOCUMENT_MAX_MB) until its bytes
// are checked; nothing reaches the file store before that.
import type { RequestHandler } from 'express'
import multer from 'multer'
import { HttpError } from '../errors'
import { CERTIFICATE_DOCUMENT_FIELD, CERTIFICATE_DOCUMENT_MAX_MB } from '../../shared/vocab/certificates'
import { uploadError } from './upload'

const parse = multer({
  storage: multer.memoryStorage(),
  limits: {
    fileSize: CERTIFICATE_DOCUMENT_MAX_MB * 1024 * 1024,
    files: 1,
    fields: 5,
    fieldSize: 1024,
    parts: 6,
  },
}).single(CERTIFICATE_DOCUMENT_FIELD)

export const certificateUpload: RequestHandler = (req, res, next) => {
  parse(req, res, (err?: unknown) => {
    if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE')
      return next(
        new HttpError(
          413,
          'too_large',
          `The document may be at most ${CERTIFICATE_DOCUMENT_MAX_MB} MB. Scan it at a lower resolution or save a smaller PDF.`,
          { maxMb: CERTIFICATE_DOCUMENT_MAX_MB },
        ),
      )
    next(err ? uploadError(err, CERTIFICATE_DOCUMENT_MAX_MB, 1, CERTIFICATE_DOCUMENT_FIELD) : undefined)
  })
}
