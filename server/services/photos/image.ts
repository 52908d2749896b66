// The re-encode that strips every photo's metadata: a JPEG of at most FULL_SIDE and a thumbnail.
import { Jimp } from 'jimp'
import { badRequest } from '../../errors'
import type { AcceptedMime } from './checks'
import { decodeWebpBitmap } from './webp'

export const FULL_SIDE = 2048
export const THUMB_SIDE = 320
export const JPEG_QUALITY = 82

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
  return img.resize({
    w: Math.max(1, Math.round(img.width * scale)),
    h: Math.max(1, Math.round(img.height * scale)),
  }) as Img
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
