// What a crew visit may record and what it does to a string. The server enforces these rules; the
// phone checks them first, so nothing doomed is queued, and previews the result offline.
import type { Condition } from './string-status'
import type { Reason } from './engine/reason-codes'

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

/** Every lamp the string holds: one chain's lamps × its parallel chains (`branches`, default 1). */
export function lampTotal(type: { classes: { count: number }[]; branches?: number | null }): number {
  return type.classes.reduce((n, k) => n + k.count, 0) * Math.max(1, type.branches ?? 1)
}

/** Bright lamps found on a visit cannot outnumber the lamps in the string. */
export function brightLampsError(brightLamps: number, total: number): string | undefined {
  return brightLamps > total ? `This string has ${total} lamps; ${brightLamps} cannot be bright.` : undefined
}

/**
 * The advice for lamps brighter than their neighbours (trade-reference §2a, common practice): their
 * filament coils have touched after a knock while hot, so they run hotter and fail sooner. Its code
 * is a live-socket code, so the isolation caution shows beside it.
 */
export function brightLampsAdvice(brightLamps: number): Reason | null {
  if (brightLamps <= 0) return null
  const one = brightLamps === 1
  return {
    code: 'bright_lamps',
    text: one
      ? '1 lamp is brighter than the others: its coils have stuck together after a knock, so it runs ' +
        'hot and fails early. Isolate the string, tap the lamp gently so the coils separate (or replace ' +
        'it), and stop the string swinging against hard surfaces: tie it back or pad it.'
      : `${brightLamps} lamps are brighter than the others: their coils have stuck together after a ` +
        'knock, so they run hot and fail early. Isolate the string, tap each bright lamp gently so the ' +
        'coils separate (or replace it), and stop the string swinging against hard surfaces: tie it ' +
        'back or pad it.',
  }
}
