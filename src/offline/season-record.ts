// Queues a season record — commissioning, store inspection or take-down — and its photos in the
// outbox, like a visit: stored on the phone with its Idempotency-Key before any network call, then
// sent in order (record → photos). The photos go to the visit row the record answers with.
import { offlineDb } from './db'
import { nextSeq } from './outbox-repo'
import type { PhotoEntry, SeasonEntry } from './outbox-types'
import type { CommissioningBody, StoreInspectionBody, TakeDownBody } from '../../shared/schemas/season'
import { seasonApi } from '../api/season'

export type SeasonRecord =
  | { type: 'commissioning'; body: CommissioningBody }
  | { type: 'store_inspection'; body: StoreInspectionBody }
  | { type: 'take_down'; body: TakeDownBody }

/** What the server answered: the record, and the visit row its photos attach to. */
export interface SeasonSent {
  id: number
  visitId: number
  seasonState: string
  result?: 'pass' | 'advisory' | 'fail'
}

export interface SeasonSave {
  /** Made when the form opens, so a second tap of Save does not record twice. */
  key: string
  stringId: number
  assetTag: string
  record: SeasonRecord
  photos: { key: string; blob: Blob; name: string }[]
}

export async function queueSeasonRecord(save: SeasonSave, userId: number): Promise<void> {
  const base = {
    groupId: save.key,
    userId,
    stringId: save.stringId,
    assetTag: save.assetTag,
    createdAt: new Date().toISOString(),
    state: 'pending' as const,
    attempts: 0,
    nextAttemptAt: 0,
    lastError: null,
    sentAt: null,
  }
  const record: SeasonEntry = {
    ...base,
    kind: 'season',
    key: save.key,
    seq: nextSeq(),
    record: save.record,
    result: null,
  }
  const photos: PhotoEntry[] = save.photos.map((p) => ({
    ...base,
    kind: 'photo',
    key: p.key,
    seq: nextSeq(),
    visitKey: '',
    seasonKey: save.key,
    fileName: p.name,
    file: p.blob,
    result: null,
  }))
  const tx = (await offlineDb()).transaction('outbox', 'readwrite')
  for (const e of [record, ...photos]) await tx.store.put(e)
  await tx.done
}

/** Sends one season record under its key; a repeat answers the first record. */
export async function sendSeasonRecord(e: SeasonEntry): Promise<SeasonSent> {
  const r = e.record
  if (r.type === 'commissioning') return seasonApi.commission(e.key, e.stringId, r.body)
  if (r.type === 'store_inspection') return seasonApi.inspectInStore(e.key, e.stringId, r.body)
  return seasonApi.takeDown(e.key, e.stringId, r.body)
}
