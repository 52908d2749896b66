// Where uploaded files (photos, documents) live: a folder on local disk by default, or an
// S3-compatible bucket when S3_URL is set, so several app servers share one store.
export interface FileStore {
  /** Stores a new file under `name`; names are random and never reused. */
  put(name: string, bytes: Buffer, contentType: string): Promise<void>
  /** The file's bytes, or null when there is no such file. */
  get(name: string): Promise<Buffer | null>
  /** Removes a file; a missing one is not an error. */
  remove(name: string): Promise<void>
  /** Every stored name (for backups). */
  list(): Promise<string[]>
  /** "local folder /srv/uploads" or "S3 bucket photos at https://…", for logs and backups. */
  readonly where: string
}
