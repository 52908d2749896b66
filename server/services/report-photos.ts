// One photo with a public report, and the single-photo store that emergency logs use too: the bytes
// pass the field photos' checks (photos/checks.ts: type sniffed from the bytes, size from the header)
// and re-encode (photos/image.ts on its own thread, which drops every bit of metadata, GPS included),
// then go to the file store. Report photos are served only to signed-in staff.
import { randomBytes, randomUUID } from 'node:crypto'
import type { Response } from 'express'
import type { Db } from '../db'
import type { FileStore } from '../files/index'
import { API_PREFIX } from '../openapi'
import { badRequest, notFound } from '../errors'
import { checkImage } from './photos/checks'
import { reencodeOffThread } from './photos/reencode-pool'
import { hashToken } from './users'

export interface OnePhoto {
  buffer: Buffer
  originalname: string
}

export interface StoredPhoto {
  fileName: string
  thumbName: string
  width: number
  height: number
  bytes: number
}

/** Checks, re-encodes and stores one photo; the caller removes the two files if its insert fails. */
export async function storeOnePhoto(store: FileStore, file: OnePhoto | undefined): Promise<StoredPhoto> {
  if (!file) throw badRequest('no_photo', 'Attach a photo in the form field "photo".')
  const name = file.originalname || 'photo'
  const mime = await checkImage(file.buffer, name)
  const encoded = await reencodeOffThread(file.buffer, mime, name)
  const stored = {
    fileName: `${randomUUID()}.jpg`,
    thumbName: `${randomUUID()}.jpg`,
    width: encoded.width,
    height: encoded.height,
    bytes: encoded.full.length,
  }
  await store.put(stored.fileName, encoded.full, 'image/jpeg')
  try {
    await store.put(stored.thumbName, encoded.thumb, 'image/jpeg')
  } catch (err) {
    await store.remove(stored.fileName)
    throw err
  }
  return stored
}

export const removeStored = (store: FileStore, p: StoredPhoto) =>
  Promise.all([store.remove(p.fileName), store.remove(p.thumbName)])

/** Sends a stored JPEG, cached privately (names never change). */
export async function sendStored(store: FileStore, name: string | null | undefined, res: Response) {
  const bytes = name ? await store.get(name) : null
  if (!bytes) throw notFound('Photo')
  res.set({ 'Cache-Control': 'private, max-age=86400', 'Content-Type': 'image/jpeg' }).send(bytes)
}

export const reportPhotoUrls = (id: number) => ({
  url: `${API_PREFIX}/report-photos/${id}/file`,
  thumbUrl: `${API_PREFIX}/report-photos/${id}/thumb`,
})

/** A new one-time key for the report's photo; only its hash is kept. */
export async function issuePhotoKey(db: Db, reportId: number): Promise<string> {
  const key = randomBytes(24).toString('base64url')
  await db('reports')
    .where({ id: reportId })
    .update({ photoKeyHash: hashToken(key) })
  return key
}

/**
 * Stores the one photo a report may carry, when `key` is the one its answer gave. A repeat with the
 * same key (the answer was lost) answers `created: false`; a key of another report, or a report that
 * does not exist, is 404 either way so references cannot be probed.
 */
export async function saveReportPhoto(
  db: Db,
  store: FileStore,
  ref: string,
  key: string,
  file: OnePhoto | undefined,
  now = new Date(),
): Promise<{ created: boolean; result: { ref: string; photo: boolean } }> {
  const report = await db('reports')
    .where({ ref, photoKeyHash: hashToken(key) })
    .first('id')
  if (!report) throw notFound('Report')
  const answer = { ref, photo: true }
  if (await db('reportPhotos').where({ reportId: report.id }).first('id'))
    return { created: false, result: answer }
  const stored = await storeOnePhoto(store, file)
  try {
    await db('reportPhotos').insert({ reportId: report.id, ...stored, createdAt: now })
  } catch (err) {
    await removeStored(store, stored)
    // Sent twice at once: the UNIQUE report_id keeps the first.
    if ((err as { code?: string }).code === 'ER_DUP_ENTRY') return { created: false, result: answer }
    throw err
  }
  return { created: true, result: answer }
}

export async function sendReportPhoto(
  db: Db,
  store: FileStore,
  id: number,
  kind: 'file' | 'thumb',
  res: Response,
) {
  const row = await db('reportPhotos').where({ id }).first('fileName', 'thumbName')
  if (!row) throw notFound('Photo')
  return sendStored(store, kind === 'file' ? row.fileName : row.thumbName, res)
}
