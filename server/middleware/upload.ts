// Multipart photo uploads held in memory: the bytes are checked and re-encoded before anything
// touches the disk, so a rejected upload leaves nothing behind.
import type { RequestHandler } from 'express'
import multer from 'multer'
import type { Config } from '../config'
import { HttpError, badRequest } from '../errors'
import { MAX_PHOTOS_PER_UPLOAD, PHOTO_FIELD } from '../../shared/vocab/photos'

const MB = 1024 * 1024

/** Multer's and busboy's errors, in our error shape with stable codes. */
export function uploadError(err: unknown, maxMb: number, maxFiles: number, field: string): HttpError {
  if (err instanceof HttpError) return err
  if (err instanceof multer.MulterError) {
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return new HttpError(413, 'too_large', `Each photo may be at most ${maxMb} MB.`, { maxMb })
      case 'LIMIT_FILE_COUNT':
        return badRequest('too_many_files', `Send at most ${maxFiles} photos at once.`, { maxFiles })
      case 'LIMIT_UNEXPECTED_FILE':
        return badRequest('unexpected_field', `Send photos in the form field "${field}".`, {
          field: err.field,
        })
      default:
        return badRequest('invalid_upload', `The upload was not accepted (${err.message}).`)
    }
  }
  // Busboy rejects a malformed multipart body with a plain Error.
  return badRequest('invalid_upload', 'The upload could not be read as multipart form data.')
}

/** Parses up to `maxFiles` files of form field `field` into req.files (memory), each under the size limit. */
export function memoryUpload(
  config: Pick<Config, 'UPLOAD_MAX_MB'>,
  field = PHOTO_FIELD,
  maxFiles = MAX_PHOTOS_PER_UPLOAD,
): RequestHandler {
  const maxMb = config.UPLOAD_MAX_MB
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: Math.floor(maxMb * MB),
      files: maxFiles,
      fields: 20,
      fieldSize: 64 * 1024,
      parts: maxFiles + 20,
    },
  }).array(field, maxFiles)
  return (req, res, next) => {
    parse(req, res, (err?: unknown) => next(err ? uploadError(err, maxMb, maxFiles, field) : undefined))
  }
}
