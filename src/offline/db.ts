// The phone's own store (IndexedDB via idb): the outbox of unsent writes, and copies of the run and
// its strings so the visit form still works without signal.
import { openDB, type DBSchema, type IDBPDatabase } from 'idb'
import type { MyRun } from '../api/runs'
import type { StringDetail } from '../../shared/schemas/strings'
import type { VisitResult } from '../api/visits'
import type { OutboxEntry } from './outbox-types'
import type { VisitDraft } from './visit-record'

export interface CachedString {
  id: number
  detail: StringDetail
  savedAt: string
  /** The last visit result this phone received, newer than `detail` until the server's copy includes it. */
  lastResult: (VisitResult & { at: string }) | null
}

export interface CachedRun {
  /** `${userId}:${date}` */
  id: string
  userId: number
  date: string
  run: MyRun
  savedAt: string
}

interface LampwrightDb extends DBSchema {
  outbox: { key: string; value: OutboxEntry; indexes: { bySeq: number; byGroup: string } }
  strings: { key: number; value: CachedString }
  runs: { key: string; value: CachedRun }
  /** Unsaved visit forms by string id, so a locked phone or a dropped tab loses nothing. */
  drafts: { key: number; value: VisitDraft }
}

const DB_NAME = 'lampwright'
const DB_VERSION = 1

let opening: Promise<IDBPDatabase<LampwrightDb>> | null = null

export function offlineDb(): Promise<IDBPDatabase<LampwrightDb>> {
  opening ??= openDB<LampwrightDb>(DB_NAME, DB_VERSION, {
    upgrade(db) {
      const outbox = db.createObjectStore('outbox', { keyPath: 'key' })
      outbox.createIndex('bySeq', 'seq')
      outbox.createIndex('byGroup', 'groupId')
      db.createObjectStore('strings', { keyPath: 'id' })
      db.createObjectStore('runs', { keyPath: 'id' })
      db.createObjectStore('drafts', { keyPath: 'stringId' })
    },
    // Another tab opened a newer version: step aside so it can upgrade.
    blocking() {
      void opening?.then((db) => db.close())
      opening = null
    },
  }).catch((err) => {
    opening = null
    throw err
  })
  return opening
}
