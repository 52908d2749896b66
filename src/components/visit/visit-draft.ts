// The visit form as typed, and how it becomes the isolation and visit requests. Pure: no Vue, no I/O.
import type { IsolationBody, VisitBody } from '../../../shared/schemas/visits'
import { isolateSteps, restoreSteps } from '../../../shared/vocab/visits'
import {
  NO_ISOLATION_MESSAGE,
  NO_ISOLATION_MIN,
  brightLampsError,
  countErrors,
  isRelamping,
} from '../../../shared/visit-rules'
import { localStamp } from '../../dates'

// The draft's shape belongs to the phone's store (offline/), which keeps it in the outbox.
import type { DraftPhoto, StepStamp, VisitDraft } from '../../offline/visit-record'
export type { DraftPhoto, StepStamp, VisitDraft }

// One way to make an Idempotency-Key for every keyed write; re-exported for the form's callers.
import { newKey } from '../../api/idempotency-key'
export { newKey }

export function newDraft(stringId: number, assetTag: string): VisitDraft {
  return {
    stringId,
    assetTag,
    visitKey: newKey(),
    isolationKey: newKey(),
    groupId: null,
    failedFound: 0,
    replaced: 0,
    fuseReplaced: false,
    darkOnArrival: false,
    leaveMadeSafe: false,
    brightLamps: 0,
    readings: { supplyVolts: '', amps: '', coldOhms: '' },
    notes: '',
    isolationMode: 'steps',
    noIsolationReason: '',
    lockId: '',
    testerId: '',
    steps: {},
    photos: [],
    startedAt: localStamp(),
  }
}

export function isolatedBeforeWork(d: VisitDraft): boolean {
  return isolateSteps.every((s) => d.steps[s])
}

export function hasAnyStep(d: VisitDraft): boolean {
  return Object.keys(d.steps).length > 0
}

/** Turns a typed number ("230", "0,48") into a number, or undefined when blank or unreadable. */
export function parseReading(text: string): number | undefined {
  const t = text.trim().replace(',', '.')
  if (!t) return undefined
  const n = Number(t)
  return Number.isFinite(n) ? n : undefined
}

export function toIsolationBody(d: VisitDraft): IsolationBody | null {
  if (d.isolationMode !== 'steps' || !hasAnyStep(d)) return null
  const steps = [...isolateSteps, ...restoreSteps]
    .filter((s) => d.steps[s])
    .map((s) => {
      const st = d.steps[s]!
      const value = st.value?.trim()
      return value ? { step: s, doneAt: st.doneAt, value } : { step: s, doneAt: st.doneAt }
    })
  return {
    stringId: d.stringId,
    ...(d.lockId.trim() ? { lockId: d.lockId.trim() } : {}),
    ...(d.testerId.trim() ? { testerId: d.testerId.trim() } : {}),
    steps,
  }
}

export function toVisitBody(d: VisitDraft, visitedAt: string): VisitBody {
  const readings = {
    supplyVolts: parseReading(d.readings.supplyVolts),
    amps: parseReading(d.readings.amps),
    coldOhms: parseReading(d.readings.coldOhms),
  }
  const anyReading = Object.values(readings).some((v) => v !== undefined)
  const body: VisitBody = {
    stringId: d.stringId,
    failedFound: d.failedFound,
    replaced: d.replaced,
    fuseReplaced: d.fuseReplaced,
    darkOnArrival: d.darkOnArrival,
    leaveMadeSafe: d.leaveMadeSafe,
    brightLamps: d.brightLamps ?? 0,
    visitedAt,
  }
  if (anyReading) body.readings = JSON.parse(JSON.stringify(readings))
  if (d.notes.trim()) body.notes = d.notes.trim()
  // The isolation's own key links it even while both still wait in the outbox (the id comes later).
  if (d.isolationMode === 'steps' && isolatedBeforeWork(d)) body.isolationKey = d.isolationKey
  else if (d.isolationMode === 'none' && isRelamping(d)) body.noIsolationReason = d.noIsolationReason.trim()
  return body
}

export type DraftErrors = Partial<
  Record<'failedFound' | 'replaced' | 'brightLamps' | 'isolation' | 'noIsolationReason' | 'readings', string>
>

/**
 * The checks the server makes too (shared/visit-rules.ts), made here first so nothing doomed is queued.
 * `lampTotal` is every lamp in the string (visit-rules lampTotal), the most that can be bright.
 */
export function checkDraft(
  d: VisitDraft,
  lampsOutBefore: number,
  capacity: number,
  lampTotal = Infinity,
): DraftErrors {
  const errors: DraftErrors = countErrors(lampsOutBefore, d, capacity)
  const bright = brightLampsError(d.brightLamps ?? 0, lampTotal)
  if (bright) errors.brightLamps = bright
  if (isRelamping(d)) {
    if (d.isolationMode === 'steps' && !isolatedBeforeWork(d))
      errors.isolation = 'Finish the six steps before work, or choose "No isolation needed" and say why.'
    if (d.isolationMode === 'none' && d.noIsolationReason.trim().length < NO_ISOLATION_MIN)
      errors.noIsolationReason = NO_ISOLATION_MESSAGE
  }
  const bad = Object.entries(d.readings).filter(([, t]) => t.trim() && parseReading(t) === undefined)
  if (bad.length) errors.readings = 'Readings must be numbers.'
  return errors
}
