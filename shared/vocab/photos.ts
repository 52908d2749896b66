/** Field name of the multipart upload; the form may repeat it up to MAX_PHOTOS_PER_UPLOAD times. */
export const PHOTO_FIELD = 'photo'
export const MAX_PHOTOS_PER_UPLOAD = 8
