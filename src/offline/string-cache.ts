// Copies of string details on the phone, so the visit form opens and previews without signal.
import { ApiError } from '../api/http'
import { stringsApi, type StringDetail } from '../api/strings'
import type { VisitResult } from '../api/visits'
import { offlineDb, type CachedString } from './db'

export interface LoadedString {
  detail: StringDetail
  /** Set when the copy on the phone was used because the server could not be reached. */
  savedAt: string | null
}

/** No answer from the server (or a server fault): worth falling back to the copy on the phone. */
export function isUnreachable(err: unknown): boolean {
  return err instanceof ApiError && (err.status === 0 || err.status >= 500)
}

/** The server's copy wins once it includes our last visit; until then our result is newer. */
function withLastResult(row: CachedString): StringDetail {
  const r = row.lastResult
  if (!r || row.detail.visits.some((v) => v.id === r.id)) return row.detail
  return {
    ...row.detail,
    lampsOut: r.string.lampsOut,
    status: r.string.status,
    replaceNow: r.string.replaceNow,
  }
}

async function save(detail: StringDetail): Promise<void> {
  const db = await offlineDb()
  const old = await db.get('strings', detail.id)
  const lastResult =
    old?.lastResult && !detail.visits.some((v) => v.id === old.lastResult!.id) ? old.lastResult : null
  await db.put('strings', { id: detail.id, detail, savedAt: new Date().toISOString(), lastResult })
}

export async function cachedString(id: number): Promise<LoadedString | null> {
  const row = await (await offlineDb()).get('strings', id)
  return row ? { detail: withLastResult(row), savedAt: row.savedAt } : null
}

export async function loadString(id: number): Promise<LoadedString> {
  try {
    const detail = await stringsApi.get(id)
    await save(detail).catch(() => undefined)
    return { detail: (await cachedString(id))?.detail ?? detail, savedAt: null }
  } catch (err) {
    if (!isUnreachable(err)) throw err
    const copy = await cachedString(id)
    if (!copy) throw err
    return copy
  }
}

/** Keeps the phone's copy in step with a visit the server has just accepted. */
export async function recordVisitResult(result: VisitResult): Promise<void> {
  const db = await offlineDb()
  const row = await db.get('strings', result.string.id)
  if (row) await db.put('strings', { ...row, lastResult: { ...result, at: new Date().toISOString() } })
}

/** Fetches and stores each string, a few at a time; returns how many are now on the phone. */
export async function prefetchStrings(ids: number[], onDone?: (count: number) => void): Promise<number> {
  const queue = [...new Set(ids)]
  let done = 0
  const worker = async () => {
    for (let id = queue.shift(); id !== undefined; id = queue.shift()) {
      try {
        await save(await stringsApi.get(id))
        done++
        onDone?.(done)
      } catch {
        // One string failing (deleted, or the signal dropped) must not stop the rest.
      }
    }
  }
  await Promise.all([worker(), worker()])
  return done
}
