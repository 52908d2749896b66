import { z } from 'zod'
import { PHOTO_FIELD } from '../vocab/photos'

// Multer fills req.body with text fields only, so the file part is documented here and never required.
export const photoUploadBody = z.object({
  [PHOTO_FIELD]: z.unknown().optional().meta({
    type: 'string',
    format: 'binary',
    description: 'JPEG, PNG or WebP; repeat the field for several (up to 8).',
  }),
})

export const photoItem = z.object({
  id: z.number().int(),
  url: z.string(),
  thumbUrl: z.string(),
  width: z.number().int(),
  height: z.number().int(),
  takenAt: z.string().nullable(),
  lat: z.number().nullable(),
  lng: z.number().nullable(),
})
export type PhotoItem = z.infer<typeof photoItem>

export const photoList = z.object({ items: z.array(photoItem) })
export type PhotoList = z.infer<typeof photoList>
