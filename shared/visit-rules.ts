// What a crew visit may record and what it does to a string. The server enforces these rules; the
// phone checks them first, so nothing doomed is queued, and previews the result offline.
import type { Condition } from './string-status'

/** Shortest reason accepted for relamping without a recorded isolation. */
export const NO_ISOLATION_MIN = 10
export const NO_ISOLATION_MESSAGE = `Say why in at least ${NO_ISOLATION_MIN} characters.`

export interface VisitCounts {
  failedFound: number
  replaced: number
  fuseReplaced?: boolean
  darkOnArrival?: boolean
  leaveMadeSafe?: boolean
}

/** Relamping (lamps or the fuse lamp) is live work: it needs an isolation or a reason why none. */
export function isRelamping(v: Pick<VisitCounts, 'replaced' | 'fuseReplaced'>): boolean {
  return v.replaced > 0 || !!v.fuseReplaced
}

export type CountErrors = Partial<Record<'failedFound' | 'replaced', string>>

/**
 * The count checks: no more lamps out than the string can hold, no more replaced than are out.
 * `capacity` is shuntedLampCount(type); `lampsOutBefore` the lamps recorded out before this visit.
 */
export function countErrors(
  lampsOutBefore: number,
  v: Pick<VisitCounts, 'failedFound' | 'replaced'>,
  capacity: number,
): CountErrors {
  const errors: CountErrors = {}
  const outNow = lampsOutBefore + v.failedFound
  if (outNow > capacity)
    errors.failedFound = `This string has ${capacity} lamps; ${lampsOutBefore} are already recorded out.`
  if (v.replaced > outNow)
    errors.replaced = `Only ${outNow} lamps are out (${lampsOutBefore} recorded + ${v.failedFound} found).`
  return errors
}

/**
 * What a visit does to a string's recorded condition (the server records it, the phone previews it):
 * found lamps add to those out, replaced ones come off, a replaced fuse lamp clears the fuse, any
 * relamp lights a dark string, "leave made safe" isolates it.
 */
export function applyVisit(before: Condition, v: VisitCounts): Condition {
  const fixed = isRelamping(v)
  return {
    lampsOut: Math.max(0, before.lampsOut + v.failedFound - v.replaced),
    fuseFailed: v.fuseReplaced ? false : before.fuseFailed,
    dark: v.darkOnArrival ? !fixed : before.dark && !fixed,
    isolated: !!v.leaveMadeSafe,
  }
}
