// The checks an upload passes before it is decoded, and the re-encode that strips its metadata.
import { fileTypeFromBuffer } from 'file-type'
import { imageSize } from 'image-size'
import { Jimp } from 'jimp'
import { HttpError, badRequest } from '../../errors'
import { decodeWebpBitmap } from './webp'

export const ACCEPTED = ['image/jpeg', 'image/png', 'image/webp'] as const
export type AcceptedMime = (typeof ACCEPTED)[number]

// Decoding costs memory in proportion to the pixels a header declares, not the bytes sent: a 141-byte
// PNG declaring 20000×20000 took jimp 30 s and 4.8 GB here (handbook toolchain.md), so these limits are
// checked from the header first. 40 MP is above any phone camera a crew carries (common practice, no source).
export const MAX_MEGAPIXELS = 40
export const MAX_SIDE = 12000
export const FULL_SIDE = 2048
export const THUMB_SIDE = 320
export const JPEG_QUALITY = 82

/** Sniffs the bytes (never the name or declared type) and reads the declared size without decoding. */
export async function checkImage(bytes: Uint8Array, name: string): Promise<AcceptedMime> {
  if (bytes.byteLength === 0) throw badRequest('empty_file', `"${name}" is empty.`)
  const type = await fileTypeFromBuffer(bytes)
  if (!type || !(ACCEPTED as readonly string[]).includes(type.mime)) {
    throw new HttpError(415, 'unsupported_type', `"${name}" is not a JPEG, PNG or WebP image.`, {
      detected: type?.mime ?? null,
    })
  }
  let size: { width?: number; height?: number }
  try {
    size = imageSize(bytes)
  } catch {
    throw badRequest('unreadable_image', `"${name}" could not be read as an image.`)
  }
  const { width = 0, height = 0 } = size
  if (width < 1 || height < 1) throw badRequest('unreadable_image', `"${name}" declares no size.`)
  if (width > MAX_SIDE || height > MAX_SIDE || width * height > MAX_MEGAPIXELS * 1e6) {
    throw badRequest(
      'image_dimensions',
      `"${name}" is ${width}×${height}; photos may be at most ${MAX_MEGAPIXELS} megapixels and ${MAX_SIDE} pixels a side.`,
      { width, height, maxMegapixels: MAX_MEGAPIXELS, maxSide: MAX_SIDE },
    )
  }
  return type.mime as AcceptedMime
}

async function decode(bytes: Uint8Array, mime: AcceptedMime, name: string) {
  try {
    // Jimp.read turns JPEGs upright by their EXIF Orientation before the metadata is dropped.
    if (mime === 'image/webp') return Jimp.fromBitmap(await decodeWebpBitmap(bytes))
    return await Jimp.read(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength))
  } catch {
    throw badRequest('unreadable_image', `"${name}" could not be decoded.`)
  }
}

type Img = Awaited<ReturnType<typeof decode>>

function fitWithin(img: Img, side: number): Img {
  const scale = side / Math.max(img.width, img.height)
  if (scale >= 1) return img
  return img.resize({ w: Math.max(1, Math.round(img.width * scale)), h: Math.max(1, Math.round(img.height * scale)) }) as Img
}

export interface Encoded {
  full: Buffer
  thumb: Buffer
  width: number
  height: number
}

/** A JPEG no larger than FULL_SIDE and a THUMB_SIDE thumbnail, both without any metadata. */
export async function reencode(bytes: Uint8Array, mime: AcceptedMime, name: string): Promise<Encoded> {
  let img = await decode(bytes, mime, name)
  if (mime !== 'image/jpeg') {
    // JPEG has no alpha: lay transparent areas on white rather than the encoder's black.
    const flat = new Jimp({ width: img.width, height: img.height, color: 0xffffffff })
    img = flat.composite(img, 0, 0) as Img
  }
  const full = fitWithin(img, FULL_SIDE)
  const thumb = fitWithin(full.clone() as Img, THUMB_SIDE)
  return {
    full: await full.getBuffer('image/jpeg', { quality: JPEG_QUALITY }),
    thumb: await thumb.getBuffer('image/jpeg', { quality: JPEG_QUALITY }),
    width: full.width,
    height: full.height,
  }
}
