// The register import's file, held in memory (at most IMPORT_MAX_MB): it is parsed, never stored.
import type { RequestHandler } from 'express'
import multer from 'multer'
import { HttpError } from '../errors'
import { IMPORT_FIELD, IMPORT_MAX_MB } from '../../shared/schemas/register'
import { uploadError } from './upload'

const parse = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: IMPORT_MAX_MB * 1024 * 1024, files: 1, fields: 10, fieldSize: 1024, parts: 12 },
}).single(IMPORT_FIELD)

export const registerUpload: RequestHandler = (req, res, next) => {
  parse(req, res, (err?: unknown) => {
    if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE')
      return next(
        new HttpError(
          413,
          'too_large',
          `The file may be at most ${IMPORT_MAX_MB} MB. Split it into smaller files.`,
          {
            limit: IMPORT_MAX_MB * 1024 * 1024,
          },
        ),
      )
    next(err ? uploadError(err, IMPORT_MAX_MB, 1, IMPORT_FIELD) : undefined)
  })
}
