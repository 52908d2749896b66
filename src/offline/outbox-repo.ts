// Reading and writing outbox entries in IndexedDB. Every write lands here before any network call.
import { offlineDb } from './db'
import type { OutboxEntry, PhotoEntry, QueuedSave } from './outbox-types'
import { plainDraft, type VisitDraft } from './visit-record'

/** Sent entries stay listed for a while as a receipt, then go. */
const KEEP_SENT_MS = 2 * 24 * 3600 * 1000

let lastSeq = 0
export function nextSeq(): number {
  // Microsecond-scaled clock so entries made in one millisecond still keep their order.
  lastSeq = Math.max(Date.now() * 1000, lastSeq + 1)
  return lastSeq
}

export async function listEntries(): Promise<OutboxEntry[]> {
  const db = await offlineDb()
  return db.getAllFromIndex('outbox', 'bySeq')
}

export async function getEntry(key: string): Promise<OutboxEntry | undefined> {
  return (await offlineDb()).get('outbox', key)
}

export async function putEntry(entry: OutboxEntry): Promise<void> {
  await (await offlineDb()).put('outbox', entry)
}

export async function groupEntries(groupId: string): Promise<OutboxEntry[]> {
  const rows = await (await offlineDb()).getAllFromIndex('outbox', 'byGroup', groupId)
  return rows.sort((a, b) => a.seq - b.seq)
}

export async function deleteEntries(keys: string[]): Promise<void> {
  const tx = (await offlineDb()).transaction('outbox', 'readwrite')
  await Promise.all([...keys.map((k) => tx.store.delete(k)), tx.done])
}

export async function pruneSent(now = Date.now()): Promise<void> {
  const stale = (await listEntries()).filter(
    (e) => e.state === 'sent' && e.sentAt && now - Date.parse(e.sentAt) > KEEP_SENT_MS,
  )
  if (stale.length) await deleteEntries(stale.map((e) => e.key))
}

/**
 * Queues one save of the visit form: its isolation (if any steps were stamped), the visit, then one
 * entry per photo, in that order. Re-saving a refused save replaces its unsent entries under the same
 * keys, so the server still sees one isolation and one visit.
 */
export async function queueSave(save: QueuedSave, userId: number): Promise<string> {
  const { groupId, draft } = save
  const now = new Date().toISOString()
  const base = {
    groupId,
    userId,
    stringId: draft.stringId,
    assetTag: draft.assetTag,
    createdAt: now,
    state: 'pending' as const,
    attempts: 0,
    nextAttemptAt: 0,
    lastError: null,
    sentAt: null,
  }
  const entries: OutboxEntry[] = []
  if (save.isolation)
    entries.push({
      ...base,
      kind: 'isolation',
      key: draft.isolationKey,
      seq: nextSeq(),
      body: save.isolation,
    })
  // Photos live in their own entries; reopening a refused save collects them from there.
  const stored: VisitDraft = { ...plainDraft(draft), groupId, photos: [] }
  entries.push({
    ...base,
    kind: 'visit',
    key: draft.visitKey,
    seq: nextSeq(),
    body: save.visit,
    draft: stored,
    result: null,
  })
  for (const p of draft.photos) {
    const photo: PhotoEntry = {
      ...base,
      kind: 'photo',
      key: p.id,
      seq: nextSeq(),
      visitKey: draft.visitKey,
      fileName: p.name,
      file: p.blob,
      result: null,
    }
    entries.push(photo)
  }

  const db = await offlineDb()
  const tx = db.transaction('outbox', 'readwrite')
  // A recorded visit's key again would only replay the old record: never let a form reuse it.
  if ((await tx.store.get(draft.visitKey))?.state === 'sent') {
    tx.done.catch(() => undefined)
    tx.abort()
    throw new Error('This visit has already been recorded; start a new one.')
  }
  const previous = await tx.store.index('byGroup').getAll(groupId)
  for (const old of previous) if (old.state !== 'sent') await tx.store.delete(old.key)
  for (const e of entries) await tx.store.put(e)
  await tx.done
  return groupId
}
