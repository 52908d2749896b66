// Capture time and position from EXIF, read before re-encoding (jimp writes no metadata).
import exifr from 'exifr'

export interface PhotoMeta {
  takenAt: Date | null
  lat: number | null
  lng: number | null
}

const none: PhotoMeta = { takenAt: null, lat: null, lng: null }

/**
 * DateTimeOriginal is 'YYYY:MM:DD HH:MM:SS' with no zone (CIPA DC-008 Exif 2.32 §4.6.5); Exif 2.31 added
 * OffsetTimeOriginal ('+01:00'). Without an offset the wall-clock time is kept as if it were UTC, which is
 * exact for winter work in the UK (GMT) and never shifts the day a crew saw on the camera.
 */
export function exifTime(dateTimeOriginal: unknown, offset: unknown): Date | null {
  if (typeof dateTimeOriginal !== 'string') return null
  const m = /^(\d{4}):(\d{2}):(\d{2})[ T](\d{2}):(\d{2}):(\d{2})/.exec(dateTimeOriginal.trim())
  if (!m) return null
  const zone = typeof offset === 'string' && /^[+-]\d{2}:\d{2}$/.test(offset.trim()) ? offset.trim() : 'Z'
  const d = new Date(`${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}${zone}`)
  // '0000:00:00 00:00:00' is what some cameras write when the clock was never set.
  return Number.isNaN(d.getTime()) || d.getUTCFullYear() < 1990 ? null : d
}

const coord = (v: unknown, max: number): number | null =>
  typeof v === 'number' && Number.isFinite(v) && Math.abs(v) <= max ? Math.round(v * 1e6) / 1e6 : null

/** Never throws: a photo with broken or absent EXIF is still a photo. */
export async function readPhotoMeta(bytes: Uint8Array): Promise<PhotoMeta> {
  try {
    const tags = await exifr.parse(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength), {
      gps: true,
      reviveValues: false,
      pick: [
        'DateTimeOriginal',
        'OffsetTimeOriginal',
        'GPSLatitude',
        'GPSLatitudeRef',
        'GPSLongitude',
        'GPSLongitudeRef',
      ],
    })
    if (!tags) return none
    const lat = coord(tags.latitude, 90)
    const lng = coord(tags.longitude, 180)
    // A 0,0 fix is a receiver that had no fix, not a photo taken in the Gulf of Guinea.
    const hasFix = lat !== null && lng !== null && !(lat === 0 && lng === 0)
    return {
      takenAt: exifTime(tags.DateTimeOriginal, tags.OffsetTimeOriginal),
      lat: hasFix ? lat : null,
      lng: hasFix ? lng : null,
    }
  } catch {
    return none
  }
}
