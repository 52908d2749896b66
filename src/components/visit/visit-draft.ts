// The visit form as typed, and how it becomes the isolation and visit requests. Pure: no Vue, no I/O.
import dayjs from 'dayjs'
import {
  isolateSteps,
  restoreSteps,
  type IsolationBody,
  type IsolationStep,
  type VisitBody,
} from '../../../shared/schemas/visits'

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

export const NO_ISOLATION_MIN = 10

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

/** A copy without Vue's proxies: IndexedDB can store plain objects and Blobs, not proxies. */
export function plainDraft(draft: VisitDraft): VisitDraft {
  return {
    ...draft,
    readings: { ...draft.readings },
    steps: Object.fromEntries(Object.entries(draft.steps).map(([k, v]) => [k, { ...v }])),
    photos: draft.photos.map((p) => ({ id: p.id, name: p.name, blob: p.blob })),
  }
}

/** Local time with its UTC offset, as the isolation record wants it. */
export function stamp(): string {
  return dayjs().format('YYYY-MM-DDTHH:mm:ssZ')
}

export function isRelamping(d: Pick<VisitDraft, 'replaced' | 'fuseReplaced'>): boolean {
  return d.replaced > 0 || d.fuseReplaced
}

export function isolatedBeforeWork(d: VisitDraft): boolean {
  return isolateSteps.every((s) => d.steps[s])
}

export function hasAnyStep(d: VisitDraft): boolean {
  return Object.keys(d.steps).length > 0
}

/** The next step the checklist lets the person tap; steps unlock one after another. */
export function nextStep(d: VisitDraft): IsolationStep | null {
  return [...isolateSteps, ...restoreSteps].find((s) => !d.steps[s]) ?? null
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

/** The checks the server makes too, made here first so nothing doomed is queued. */
export function checkDraft(d: VisitDraft, lampsOutBefore: number, capacity: number): DraftErrors {
  const errors: DraftErrors = {}
  const outNow = lampsOutBefore + d.failedFound
  if (outNow > capacity)
    errors.failedFound = `This string has ${capacity} lamps; ${lampsOutBefore} are already recorded out.`
  if (d.replaced > outNow)
    errors.replaced = `Only ${outNow} lamps are out (${lampsOutBefore} recorded + ${d.failedFound} found).`
  if (isRelamping(d)) {
    if (d.isolationMode === 'steps' && !isolatedBeforeWork(d))
      errors.isolation = 'Finish the six steps before work, or choose "No isolation needed" and say why.'
    if (d.isolationMode === 'none' && d.noIsolationReason.trim().length < NO_ISOLATION_MIN)
      errors.noIsolationReason = `Say why in at least ${NO_ISOLATION_MIN} characters.`
  }
  const bad = Object.entries(d.readings).filter(([, t]) => t.trim() && parseReading(t) === undefined)
  if (bad.length) errors.readings = 'Readings must be numbers.'
  return errors
}
