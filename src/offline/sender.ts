// Sends the outbox in order. A network failure or a server error (5xx) leaves the entry pending with a
// back-off; a refusal (4xx) marks it failed with the server's message and holds back the rest of its
// save, since a visit needs its isolation and photos need their visit.
import { ApiError } from '../api/http'
import { visitsApi } from '../api/visits'
import { listEntries, putEntry } from './outbox-repo'
import { reportWorkApi } from '../api/report-work'
import type {
  EmergencyEntry,
  EntryError,
  OutboxEntry,
  PhotoEntry,
  SeasonEntry,
  VisitEntry,
} from './outbox-types'
import { sendSeasonRecord } from './season-record'

export interface SendHooks {
  userId: number
  onProgress: (key: string, fraction: number | null) => void
  onChange: () => void
  onVisitSent: (entry: VisitEntry) => void
}

export interface SendOutcome {
  sent: number
  failed: number
  /** Why the pass stopped early: no connection, or the session has ended. */
  stoppedBy: 'network' | 'session' | null
  /** When the earliest held-back entry may be tried again. */
  nextAttemptAt: number | null
}

const MAX_BACKOFF_MS = 5 * 60_000

/** 5 s, 10 s, 20 s … up to 5 min, ±20 % so phones that regain signal together do not retry in step. */
export function backoffMs(attempts: number, random: () => number = Math.random): number {
  const base = Math.min(MAX_BACKOFF_MS, 5_000 * 2 ** Math.max(0, attempts - 1))
  return Math.round(base * (0.8 + 0.4 * random()))
}

function isRetryable(err: ApiError): boolean {
  return err.status === 0 || err.status === 408 || err.status === 429 || err.status >= 500
}

function toEntryError(err: unknown): EntryError {
  if (!(err instanceof ApiError)) return { status: 0, code: 'client_error', message: String(err), fields: [] }
  const details = err.details as { fields?: { path: string; message: string }[] } | undefined
  return { status: err.status, code: err.code, message: err.message, fields: details?.fields ?? [] }
}

async function sendOne(entry: OutboxEntry, all: OutboxEntry[], hooks: SendHooks): Promise<OutboxEntry> {
  const sentAt = new Date().toISOString()
  if (entry.kind === 'isolation') {
    await visitsApi.recordIsolation(entry.key, entry.body)
    return { ...entry, state: 'sent', sentAt, lastError: null }
  }
  if (entry.kind === 'visit') {
    const result = await visitsApi.logVisit(entry.key, entry.body)
    return { ...entry, state: 'sent', sentAt, lastError: null, result }
  }
  if (entry.kind === 'emergency') {
    const result = await reportWorkApi.logEmergency(entry.itemId, entry.key, entry.body)
    return { ...entry, state: 'sent', sentAt, lastError: null, result }
  }
  if (entry.kind === 'season') {
    const result = await sendSeasonRecord(entry)
    return { ...entry, state: 'sent', sentAt, lastError: null, result }
  }
  if (entry.logKey) return sendLogPhoto(entry, all, hooks, sentAt)
  // A season record's photos go to the visit row its record answered with.
  const season = entry.seasonKey
    ? all.find((e): e is SeasonEntry => e.kind === 'season' && e.key === entry.seasonKey)
    : undefined
  const visit = entry.seasonKey
    ? season?.result && { result: { id: season.result.visitId } }
    : all.find((e): e is VisitEntry => e.kind === 'visit' && e.key === entry.visitKey)
  if (!visit?.result) throw new ApiError(400, 'visit_missing', 'The record for this photo was discarded.')
  if (!entry.file) throw new ApiError(400, 'empty_file', 'The photo is no longer on this phone.')
  hooks.onProgress(entry.key, 0)
  try {
    const res = await visitsApi.uploadPhoto(visit.result.id, entry.key, entry.file, entry.fileName, (f) =>
      hooks.onProgress(entry.key, f),
    )
    return { ...entry, state: 'sent', sentAt, lastError: null, file: null, result: res.items[0] ?? null }
  } finally {
    hooks.onProgress(entry.key, null)
  }
}

/** An emergency log's photo, once its log has been accepted. */
async function sendLogPhoto(entry: PhotoEntry, all: OutboxEntry[], hooks: SendHooks, sentAt: string) {
  const log = all.find((e): e is EmergencyEntry => e.kind === 'emergency' && e.key === entry.logKey)
  if (!log?.result) throw new ApiError(400, 'log_missing', 'The emergency log for this photo was discarded.')
  if (!entry.file) throw new ApiError(400, 'empty_file', 'The photo is no longer on this phone.')
  hooks.onProgress(entry.key, 0)
  try {
    await reportWorkApi.emergencyPhoto(log.result.id, entry.key, entry.file, entry.fileName, (f) =>
      hooks.onProgress(entry.key, f),
    )
    return { ...entry, state: 'sent' as const, sentAt, lastError: null, file: null }
  } finally {
    hooks.onProgress(entry.key, null)
  }
}

/** One pass over the outbox; call again after `nextAttemptAt` or when the connection returns. */
export async function sendPending(hooks: SendHooks, now = Date.now()): Promise<SendOutcome> {
  const all = await listEntries()
  const outcome: SendOutcome = { sent: 0, failed: 0, stoppedBy: null, nextAttemptAt: null }
  const held = new Set<string>()
  const later = (at: number) => {
    outcome.nextAttemptAt = outcome.nextAttemptAt === null ? at : Math.min(outcome.nextAttemptAt, at)
  }

  for (let i = 0; i < all.length; i++) {
    const entry = all[i]
    if (entry.state === 'sent' || entry.userId !== hooks.userId) continue
    const blocksGroup = entry.kind !== 'photo'
    if (held.has(entry.groupId)) continue
    if (entry.state === 'failed' || entry.nextAttemptAt > now) {
      if (entry.state === 'pending') later(entry.nextAttemptAt)
      if (blocksGroup || entry.state === 'pending') held.add(entry.groupId)
      continue
    }
    try {
      const done = await sendOne(entry, all, hooks)
      all[i] = done
      await putEntry(done)
      outcome.sent++
      if (done.kind === 'visit') hooks.onVisitSent(done)
    } catch (err) {
      const error = toEntryError(err)
      if (error.status === 401) {
        outcome.stoppedBy = 'session'
        return outcome
      }
      if (err instanceof ApiError && isRetryable(err)) {
        const attempts = entry.attempts + 1
        const retryAt = Date.now() + backoffMs(attempts)
        await putEntry({ ...entry, attempts, nextAttemptAt: retryAt, lastError: error })
        later(retryAt)
        hooks.onChange()
        if (error.status === 0) {
          // Without a connection the rest would fail the same way; they keep their place in line.
          outcome.stoppedBy = 'network'
          return outcome
        }
        held.add(entry.groupId)
        continue
      }
      await putEntry({ ...entry, state: 'failed', attempts: entry.attempts + 1, lastError: error })
      outcome.failed++
      if (blocksGroup) held.add(entry.groupId)
    }
    hooks.onChange()
  }
  return outcome
}
