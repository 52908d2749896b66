// The visit form as typed, and how it becomes the isolation and visit requests. Pure: no Vue, no I/O.
import dayjs from 'dayjs'
import {
  isolateSteps,
  restoreSteps,
  type IsolationBody,
  type VisitBody,
} from '../../../shared/schemas/visits'
import { NO_ISOLATION_MESSAGE, NO_ISOLATION_MIN, countErrors, isRelamping } from '../../../shared/visit-rules'

// The draft's shape belongs to the phone's store (offline/), which keeps it in the outbox.
import type { DraftPhoto, StepStamp, VisitDraft } from '../../offline/visit-record'
export type { DraftPhoto, StepStamp, VisitDraft }

/** A v4 UUID. randomUUID exists only in secure contexts (https, localhost); getRandomValues everywhere. */
export function newKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID()
  const b = crypto.getRandomValues(new Uint8Array(16))
  b[6] = (b[6] & 0x0f) | 0x40
  b[8] = (b[8] & 0x3f) | 0x80
  const h = Array.from(b, (x) => x.toString(16).padStart(2, '0')).join('')
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`
}

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
    readings: { supplyVolts: '', amps: '', coldOhms: '' },
    notes: '',
    isolationMode: 'steps',
    noIsolationReason: '',
    lockId: '',
    testerId: '',
    steps: {},
    photos: [],
    startedAt: stamp(),
  }
}

/** Local time with its UTC offset, as the isolation record wants it. */
export function stamp(): string {
  return dayjs().format('YYYY-MM-DDTHH:mm:ssZ')
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
  Record<'failedFound' | 'replaced' | 'isolation' | 'noIsolationReason' | 'readings', string>
>

/** The checks the server makes too (shared/visit-rules.ts), made here first so nothing doomed is queued. */
export function checkDraft(d: VisitDraft, lampsOutBefore: number, capacity: number): DraftErrors {
  const errors: DraftErrors = countErrors(lampsOutBefore, d, capacity)
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
