// The checks an upload passes before anything decodes it: its bytes, never its name or declared type.
import { fileTypeFromBuffer } from 'file-type'
import { imageSize } from 'image-size'
import { HttpError, badRequest } from '../../errors'

export const ACCEPTED = ['image/jpeg', 'image/png', 'image/webp'] as const
export type AcceptedMime = (typeof ACCEPTED)[number]

// Decoding costs memory in proportion to the pixels a header declares, not the bytes sent: a 141-byte
// PNG declaring 20000×20000 took jimp 30 s and 4.8 GB here (handbook toolchain.md), so these limits are
// checked from the header first. 40 MP is above any phone camera a crew carries (common practice, no source).
export const MAX_MEGAPIXELS = 40
export const MAX_SIDE = 12000

/** Sniffs the type from the bytes and reads the declared size from the header, without decoding. */
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
