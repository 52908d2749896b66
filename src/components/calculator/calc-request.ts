import type { AssessRequest } from '../../../shared/schemas/engine'
import { engineInput, type Condition } from '../../../shared/string-status'
import type { LampPreset } from './presets'

/** What-if faults beyond shorted lamps and the fuse lamp: open shunts, missing lamps, a wrong lamp. */
export interface Faults {
  /** failed lamps whose shunt did not close */
  opened: number
  /** lamps missing from their sockets */
  removed: number
  /** lamps per chain replaced by a lamp of another rating */
  wrongCount: number
  wrongVolts: number
  wrongAmps: number
}

export const NO_FAULTS: Faults = { opened: 0, removed: 0, wrongCount: 0, wrongVolts: 12, wrongAmps: 0.17 }

export interface CalcRequest {
  request: AssessRequest
  /** one label per class of the request, the wrong lamp last */
  labels: string[]
}

/** The main class: the first shunted one (series filament), else the first. */
export function mainClass(p: LampPreset): number {
  return Math.max(
    0,
    p.classes.findIndex((c) => c.shunted),
  )
}

/** The engine's request for the what-if: the preset's, with the extra faults placed on the main class. */
export function calcRequest(p: LampPreset, supplyVolts: number, cond: Condition, f: Faults): CalcRequest {
  const base = engineInput(p, cond, supplyVolts)
  const m = Math.max(1, p.branches ?? 1)
  const at = mainClass(p)
  const lamps = base.lamps.map((c) => ({ ...c }))
  const labels = p.classes.map((c) => c.label)
  const main = lamps[at]
  const wrong = Math.max(0, Math.min(f.wrongCount, main.count - 1))
  if (wrong > 0 && f.wrongVolts > 0 && f.wrongAmps > 0) {
    main.count -= wrong
    lamps.push({
      count: wrong,
      ratedVolts: f.wrongVolts,
      ratedAmps: f.wrongAmps,
      shunted: main.shunted,
      failed: 0,
    })
    labels.push('Other rating')
  }
  // Everything missing from the main class fits in its lamps over every chain.
  const room = main.count * m
  main.failed = Math.min(main.failed ?? 0, room)
  main.opened = Math.min(f.opened, room - main.failed)
  main.removed = Math.min(f.removed, room - main.failed - main.opened)
  return { request: { ...base, lamps }, labels }
}
