export interface PlanCrew {
  id: string
  name: string
  depot: { lat: number; lng: number }
  /** 'HH:mm'; a shift ending at or before its start runs past midnight */
  shiftStart: string
  shiftEnd: string
  hasPlatform: boolean
}

export interface PlanItem {
  id: string
  lat: number
  lng: number
  serviceMinutes: number
  /** allowed start times of the work, 'HH:mm' (a window ending before it starts runs past midnight) */
  window?: { from: string; to: string }
  needsPlatform?: boolean
  /** higher is planned first and dropped last */
  priority: number
  /** keeps the item on this crew */
  pinnedCrewId?: string
  /** orders a crew's pinned items among themselves (lower first); other work may go between them */
  pinnedIndex?: number
}

export interface PlanSettings {
  speedKmh?: number
  detourFactor?: number
  /** travel minutes over [depots in crew order..., items in item order...]; may be asymmetric */
  matrixMinutes?: number[][]
}

export interface PlanInput {
  crews: PlanCrew[]
  items: PlanItem[]
  settings?: PlanSettings
}

export interface PlannedStop {
  itemId: string
  arrive: string
  start: string
  depart: string
  /** travel from the previous stop or the depot */
  travelMinutes: number
}

export interface CrewRun {
  crewId: string
  stops: PlannedStop[]
  /** back at the depot (the shift start when the run is empty) */
  returnAt: string
  /** including the drive back to the depot */
  totalTravelMinutes: number
  totalServiceMinutes: number
}

export type UnassignedReason = 'outside_shift' | 'window_unreachable' | 'needs_platform' | 'shift_full'

export interface UnassignedItem {
  itemId: string
  reason: UnassignedReason
  message: string
}

export interface PlanResult {
  runs: CrewRun[]
  unassigned: UnassignedItem[]
}
