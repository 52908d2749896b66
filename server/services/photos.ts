// Visit photos: checked, re-encoded without metadata, stored under random names in the file store
// (local folder or S3 bucket), listed and served.
import { randomUUID } from 'node:crypto'
import type { Response } from 'express'
import type { Db } from '../db'
import type { FileStore } from '../files/index'
import { badRequest, forbidden, notFound } from '../errors'
import type { PhotoItem } from '../../shared/schemas/photos'
import { checkImage, type AcceptedMime } from './photos/checks'
import type { Encoded } from './photos/image'
import { reencodeOffThread } from './photos/reencode-pool'
import { readPhotoMeta, type PhotoMeta } from './photos/exif'
import { photoUrls } from './photo-urls'
import { writeOnce } from './keyed-write'
import { isoOrNull } from '../../shared/iso-time'

export interface UploadedFile {
  buffer: Buffer
  originalname: string
}

const columns = ['id', 'width', 'height', 'takenAt', 'lat', 'lng'] as const

function toItem(r: Record<string, unknown>): PhotoItem {
  const id = Number(r.id)
  const takenAt = isoOrNull(r.takenAt)
  const num = (v: unknown) => (v === null || v === undefined ? null : Number(v))
  return {
    id,
    ...photoUrls(id),
    width: Number(r.width),
    height: Number(r.height),
    takenAt,
    lat: num(r.lat),
    lng: num(r.lng),
  }
}

async function requireVisit(db: Db, visitId: number): Promise<void> {
  if (!(await db('visits').where({ id: visitId }).first('id'))) throw notFound('Visit')
}

export interface Uploader {
  id: number
  role: string
  crewId: number | null
}

/** Photos belong to a visit's record: its author, the author's crew, or a supervisor may add them. */
async function requireVisitForUpload(db: Db, visitId: number, by: Uploader): Promise<void> {
  const visit = await db('visits')
    .leftJoin('users', 'users.id', 'visits.userId')
    .where('visits.id', visitId)
    .first('visits.userId', 'visits.crewId', { authorCrewId: 'users.crewId' })
  if (!visit) throw notFound('Visit')
  if (by.role === 'supervisor' || visit.userId === by.id) return
  const crews = [visit.crewId, visit.authorCrewId].filter((c) => c !== null && c !== undefined)
  if (by.crewId !== null && crews.includes(by.crewId)) return
  throw forbidden("Only the visit's author, a member of the author's crew or a supervisor may add photos.")
}

/** The photos an earlier upload with this key stored on the visit, if any. */
async function storedUpload(db: Db, visitId: number, uploadKey: string | null) {
  if (!uploadKey) return undefined
  const rows = await db('photos')
    .where({ visitId, uploadKey })
    .orderBy('uploadSeq')
    .select(...columns)
  return rows.length ? rows.map(toItem) : undefined
}

export async function listPhotos(db: Db, visitId: number): Promise<PhotoItem[]> {
  await requireVisit(db, visitId)
  const rows = await db('photos')
    .where({ visitId })
    .orderBy('id')
    .select(...columns)
  return rows.map(toItem)
}

/**
 * Stores every photo of one upload or none: all are checked before any is decoded, all are
 * re-encoded before any is written, and a failed write or insert removes the files already written.
 */
export async function savePhotos(
  db: Db,
  store: FileStore,
  visitId: number,
  by: Uploader,
  files: UploadedFile[],
  uploadKey: string | null = null,
): Promise<{ created: boolean; items: PhotoItem[] }> {
  await requireVisitForUpload(db, visitId, by)
  if (!files.length) throw badRequest('no_photo', 'Attach at least one photo in the form field "photo".')
  // A repeat that arrives after the first upload is stored is not even decoded.
  const earlier = await storedUpload(db, visitId, uploadKey)
  if (earlier) return { created: false, items: earlier }
  const mimes: AcceptedMime[] = []
  for (const f of files) mimes.push(await checkImage(f.buffer, f.originalname || 'photo'))

  const prepared: Prepared[] = []
  for (const [i, f] of files.entries()) {
    const meta = await readPhotoMeta(f.buffer)
    const encoded = await reencodeOffThread(f.buffer, mimes[i], f.originalname || 'photo')
    prepared.push({ meta, encoded, fileName: `${randomUUID()}.jpg`, thumbName: `${randomUUID()}.jpg` })
  }

  const written: string[] = []
  const removeWritten = () => Promise.all(written.map((name) => store.remove(name)))
  try {
    for (const p of prepared) {
      for (const [name, bytes] of [
        [p.fileName, p.encoded.full],
        [p.thumbName, p.encoded.thumb],
      ] as const) {
        written.push(name)
        await store.put(name, bytes, 'image/jpeg')
      }
    }
    const { created, result } = await writeOnce(db, {
      index: 'photos_upload_key_unique',
      replay: (trx) => storedUpload(trx, visitId, uploadKey),
      create: (trx) => insertPhotos(trx, visitId, by, uploadKey, prepared),
    })
    // A repeat sent while the first was still being stored: the first upload's photos stand.
    if (!created) await removeWritten()
    return { created, items: result }
  } catch (err) {
    await removeWritten()
    throw err
  }
}

interface Prepared {
  meta: PhotoMeta
  encoded: Encoded
  fileName: string
  thumbName: string
}

/** One row per photo, numbered in the upload: a repeat of the upload collides on its first photo. */
async function insertPhotos(
  trx: Db,
  visitId: number,
  by: Uploader,
  uploadKey: string | null,
  prepared: Prepared[],
): Promise<PhotoItem[]> {
  const items: PhotoItem[] = []
  for (const [uploadSeq, p] of prepared.entries()) {
    const [id] = await trx('photos').insert({
      visitId,
      fileName: p.fileName,
      thumbName: p.thumbName,
      mime: 'image/jpeg',
      width: p.encoded.width,
      height: p.encoded.height,
      bytes: p.encoded.full.length,
      takenAt: p.meta.takenAt,
      lat: p.meta.lat,
      lng: p.meta.lng,
      userId: by.id,
      uploadKey,
      uploadSeq,
    })
    items.push(toItem({ id, width: p.encoded.width, height: p.encoded.height, ...p.meta }))
  }
  return items
}

/** Sends the stored JPEG (or its thumbnail) of one photo; cached privately since URLs never change. */
export async function sendPhoto(db: Db, files: FileStore, id: number, kind: 'file' | 'thumb', res: Response) {
  const row = await db('photos').where({ id }).first('fileName', 'thumbName')
  if (!row) throw notFound('Photo')
  const bytes = await files.get(kind === 'file' ? row.fileName : row.thumbName)
  if (!bytes) throw notFound('Photo file')
  res.set({ 'Cache-Control': 'private, max-age=86400', 'Content-Type': 'image/jpeg' }).send(bytes)
}
