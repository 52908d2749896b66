// The planner's input (shared/routing PlanInput) for the chosen crews and queue items on a date, as
// the plan route builds it: refusals applied, the travel matrix asked for, pins attached.
import type { Db } from '../db'
import type { Config } from '../config'
import type { PlanInput } from '../../shared/routing/plan-types'
import type { PlanBody } from '../../shared/schemas/runs'
import { loadCrews, loadItems, toPlanCrew, toPlanItem, type CrewInfo, type ItemInfo } from './run-items'
import { travelMatrix, type TravelSource } from './travel-matrix'
import { applyRefusals, type Refused } from './plan-refusal'

export interface PreparedPlan {
  input: PlanInput
  crews: CrewInfo[]
  items: Map<number, ItemInfo>
  refused: Refused[]
  platformNotes: string[]
  travelSource: TravelSource
  pinned: Set<number>
}

export async function preparePlan(
  db: Db,
  body: PlanBody,
  config: Pick<Config, 'ROUTING_URL'> = {},
): Promise<PreparedPlan> {
  const loaded = await loadCrews(db, body.crewIds)
  // Out-of-date platforms and unapproved columns are refused before the solver (plan-refusal.ts).
  const { crews, items, refused, platformNotes } = await applyRefusals(
    db,
    loaded,
    await loadItems(db, body.itemIds),
    body.date,
  )
  // The planner's travel matrix runs over depots first, then items, in this order.
  const travel = await travelMatrix(config, [
    ...crews.map((c) => ({ lat: c.depotLat, lng: c.depotLng })),
    ...[...items.values()].map((i) => ({ lat: i.lat, lng: i.lng })),
  ])
  const pins = new Map(body.pins.map((p) => [p.itemId, p]))
  const input: PlanInput = {
    crews: crews.map(toPlanCrew),
    items: [...items.values()].map((i) => {
      const pin = pins.get(i.itemId)
      return {
        ...toPlanItem(i),
        ...(pin ? { pinnedCrewId: String(pin.crewId), pinnedIndex: pin.index } : {}),
      }
    }),
    settings: { speedKmh: body.speedKmh, detourFactor: body.detourFactor, matrixMinutes: travel.minutes },
  }
  return {
    input,
    crews,
    items,
    refused,
    platformNotes,
    travelSource: travel.source,
    pinned: new Set(pins.keys()),
  }
}
