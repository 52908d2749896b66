// The visit form as the phone keeps it: in the drafts store while it is typed, and inside a queued
// visit so a refused save reopens exactly as it was. The form (components/visit/) builds it.
import type { IsolationStep } from '../../shared/vocab/visits'

export interface StepStamp {
  /** Device time with its offset, stamped when the button was tapped. */
  doneAt: string
  /** RCD trip time in ms, for the RCD test. */
  value?: string
}

export interface DraftPhoto {
  id: string
  name: string
  blob: Blob
}

export interface VisitDraft {
  stringId: number
  assetTag: string
  /** Idempotency keys, made when the form opens, so a re-save after a refusal is still the same visit. */
  visitKey: string
  isolationKey: string
  /** Set when the form reopens a refused outbox entry. */
  groupId: string | null
  failedFound: number
  replaced: number
  fuseReplaced: boolean
  darkOnArrival: boolean
  leaveMadeSafe: boolean
  /** Lamps brighter than their neighbours; drafts from before this field read as 0. */
  brightLamps?: number
  /** As typed, so "12," or an empty field survive a reload untouched. */
  readings: { supplyVolts: string; amps: string; coldOhms: string }
  notes: string
  isolationMode: 'steps' | 'none'
  noIsolationReason: string
  lockId: string
  testerId: string
  steps: Partial<Record<IsolationStep, StepStamp>>
  photos: DraftPhoto[]
  startedAt: string
}

/** A copy without Vue's proxies: IndexedDB can store plain objects and Blobs, not proxies. */
export function plainDraft(draft: VisitDraft): VisitDraft {
  return {
    ...draft,
    readings: { ...draft.readings },
    steps: Object.fromEntries(Object.entries(draft.steps).map(([k, v]) => [k, { ...v }])),
    photos: draft.photos.map((p) => ({ id: p.id, name: p.name, blob: p.blob })),
  }
}
