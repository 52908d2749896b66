// A certificate's document: the PDF the inspector issued, or a photo of the paper. Its type is read
// from its bytes (never its name or declared type), it is kept in the file store under a random name,
// and it is served only through a route row limited to office staff. The newest upload is the one
// shown; earlier ones are kept (records are never deleted).
import { randomUUID } from 'node:crypto'
import type { Response } from 'express'
import { fileTypeFromBuffer } from 'file-type'
import type { Db } from '../db'
import type { FileStore } from '../files/index'
import { HttpError, badRequest, notFound } from '../errors'
import { iso } from '../../shared/iso-time'
import { certificateDocumentTypes } from '../../shared/vocab/certificates'

type DocType = (typeof certificateDocumentTypes)[number]
const EXT: Record<DocType, string> = { 'application/pdf': 'pdf', 'image/jpeg': 'jpg', 'image/png': 'png' }

/** The document's type from its first bytes; 415 for anything but a PDF, JPEG or PNG. */
export async function checkDocument(bytes: Uint8Array, name: string): Promise<DocType> {
  if (bytes.byteLength === 0) throw badRequest('empty_file', `"${name}" is empty.`)
  const type = await fileTypeFromBuffer(bytes)
  if (!type || !(certificateDocumentTypes as readonly string[]).includes(type.mime))
    throw new HttpError(415, 'unsupported_type', `"${name}" is not a PDF, JPEG or PNG file.`, {
      detected: type?.mime ?? null,
    })
  return type.mime as DocType
}

/** A name fit for a Content-Disposition header and a link's text: no paths, quotes or control characters. */
function cleanName(name: string, type: DocType): string {
  const base = (name.split(/[\\/]/).pop() ?? '')
    .replace(/[^\p{L}\p{N} ._()-]/gu, '')
    .trim()
    .slice(0, 120)
  return base || `certificate.${EXT[type]}`
}

export interface UploadedFile {
  buffer: Buffer
  originalname: string
}

/** Checks and stores the file, then records it (pass a transaction to audit it in the same commit). */
export async function storeDocument(files: FileStore, certificateId: number, file: UploadedFile) {
  const contentType = await checkDocument(file.buffer, file.originalname)
  const fileKey = `certificate-${certificateId}-${randomUUID()}.${EXT[contentType]}`
  await files.put(fileKey, file.buffer, contentType)
  return { fileKey, contentType, originalName: cleanName(file.originalname, contentType) }
}

export async function recordDocument(
  db: Db,
  userId: number,
  certificateId: number,
  stored: Awaited<ReturnType<typeof storeDocument>>,
  sizeBytes: number,
  now = new Date(),
) {
  await db('certificateDocuments').insert({
    certificateId,
    fileKey: stored.fileKey,
    originalName: stored.originalName,
    contentType: stored.contentType,
    sizeBytes,
    uploadedBy: userId,
    createdAt: now,
  })
  return { name: stored.originalName, contentType: stored.contentType, sizeBytes, uploadedAt: iso(now) }
}

export async function assertCertificate(db: Db, id: number): Promise<void> {
  if (!(await db('certificates').where({ id }).first('id'))) throw notFound('Certificate')
}

interface DocRow {
  id: number
  certificateId: number
  fileKey: string
  originalName: string
  contentType: DocType
  sizeBytes: number
  createdAt: Date
}

/** The newest document of each certificate among `ids`. */
export async function latestDocuments(db: Db, ids: number[]): Promise<Map<number, DocRow>> {
  if (!ids.length) return new Map()
  const rows: DocRow[] = await db('certificateDocuments as d')
    .whereIn('d.certificateId', ids)
    .whereRaw(
      'd.id = (select max(d2.id) from certificate_documents d2 where d2.certificate_id = d.certificate_id)',
    )
    .select('d.*')
  return new Map(rows.map((r) => [r.certificateId, r]))
}

/** Sends the newest document inline, private to the browser that fetched it. */
export async function sendDocument(db: Db, files: FileStore, certificateId: number, res: Response) {
  await assertCertificate(db, certificateId)
  const doc = (await latestDocuments(db, [certificateId])).get(certificateId)
  if (!doc) throw new HttpError(404, 'no_document', 'No document has been attached to this certificate.')
  const bytes = await files.get(doc.fileKey)
  if (!bytes) throw new HttpError(404, 'no_document', 'The document file is missing from the file store.')
  res
    .set({
      'Content-Type': doc.contentType,
      'Content-Disposition': `inline; filename="${doc.originalName}"`,
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
    })
    .send(bytes)
}
