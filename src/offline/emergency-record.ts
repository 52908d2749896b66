// Queues the crew's emergency log (and its optional photo) in the outbox, like a visit: stored on the
// phone with its Idempotency-Key before any network call, then sent in order (log → photo).
import { offlineDb } from './db'
import { nextSeq } from './outbox-repo'
import type { EmergencyEntry, PhotoEntry } from './outbox-types'
import type { EmergencyLogBody } from '../../shared/schemas/report-work'

export interface EmergencySave {
  /** Made when the form opens, so a second tap of Save does not log twice. */
  key: string
  itemId: number
  stringId: number | null
  /** What the outbox shows for it: the string's tag, or the site for a report placed by street only. */
  label: string
  body: EmergencyLogBody
  photo: { key: string; blob: Blob; name: string } | null
}

export async function queueEmergency(save: EmergencySave, userId: number): Promise<void> {
  const base = {
    groupId: save.key,
    userId,
    stringId: save.stringId ?? 0,
    assetTag: save.label,
    createdAt: new Date().toISOString(),
    state: 'pending' as const,
    attempts: 0,
    nextAttemptAt: 0,
    lastError: null,
    sentAt: null,
  }
  const log: EmergencyEntry = {
    ...base,
    kind: 'emergency',
    key: save.key,
    seq: nextSeq(),
    itemId: save.itemId,
    body: save.body,
    result: null,
  }
  const entries: (EmergencyEntry | PhotoEntry)[] = [log]
  if (save.photo)
    entries.push({
      ...base,
      kind: 'photo',
      key: save.photo.key,
      seq: nextSeq(),
      visitKey: '',
      logKey: save.key,
      fileName: save.photo.name,
      file: save.photo.blob,
      result: null,
    })
  const tx = (await offlineDb()).transaction('outbox', 'readwrite')
  for (const e of entries) await tx.store.put(e)
  await tx.done
}
