// Unsaved visit forms, one per string, so nothing typed is lost when the phone locks or the tab dies.
import { offlineDb } from './db'
import { getEntry, groupEntries } from './outbox-repo'
import type { EntryError, PhotoEntry, VisitEntry } from './outbox-types'
import { plainDraft, type VisitDraft } from './visit-record'

export async function loadDraft(stringId: number): Promise<VisitDraft | null> {
  return (await (await offlineDb()).get('drafts', stringId)) ?? null
}

export async function saveDraft(draft: VisitDraft): Promise<void> {
  await (await offlineDb()).put('drafts', plainDraft(draft))
}

export async function clearDraft(stringId: number): Promise<void> {
  await (await offlineDb()).delete('drafts', stringId)
}

/** The form as left on this phone, unless it was saved already (queued, or refused and since sent). */
export async function unsentDraft(stringId: number): Promise<VisitDraft | null> {
  const d = await loadDraft(stringId)
  if (!d) return null
  const queued = await getEntry(d.visitKey)
  if (queued && (queued.state === 'sent' || !d.groupId)) {
    await clearDraft(stringId)
    return null
  }
  return d
}

/** Reopens a refused save with what was typed and its photos, under the same keys. */
export async function draftFromOutbox(
  groupId: string,
  stringId: number,
): Promise<{ draft: VisitDraft; lastError: EntryError | null } | null> {
  const entries = await groupEntries(groupId)
  const visit = entries.find((e): e is VisitEntry => e.kind === 'visit')
  if (!visit || visit.state === 'sent' || visit.stringId !== stringId) return null
  const photos = entries
    .filter((e): e is PhotoEntry => e.kind === 'photo' && e.state !== 'sent' && !!e.file)
    .map((p) => ({ id: p.key, name: p.fileName, blob: p.file! }))
  return { draft: { ...visit.draft, groupId, photos }, lastError: visit.lastError }
}
