import type { Config } from '../config'
import type { FileStore } from './file-store'
import { localFileStore } from './local-store'
import { parseS3Url, s3FileStore } from './s3-store'

export type { FileStore } from './file-store'

/** S3_URL when set, else the local UPLOAD_DIR. */
export function createFileStore(config: Pick<Config, 'S3_URL' | 'UPLOAD_DIR'>): FileStore {
  return config.S3_URL ? s3FileStore(parseS3Url(config.S3_URL)) : localFileStore(config.UPLOAD_DIR)
}
