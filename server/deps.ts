import type { Db } from './db'
import type { Config } from './config'
import type { Mailer } from './mail/mailer'
import type { FileStore } from './files/index'

/** What the app needs from outside: built once by server/index.ts, or by a test. */
export interface AppDeps {
  db: Db
  config: Config
  jwtSecret: string
  mailer: Mailer
  /** Uploaded photos and documents: UPLOAD_DIR or the S3_URL bucket. */
  files: FileStore
  /** The clock; unset = the real one. Tests set it to fake a time of day (never a request's input). */
  now?: () => Date
}

/** Now, by the app's clock. */
export const nowOf = (deps: Pick<AppDeps, 'now'>): Date => deps.now?.() ?? new Date()
