import { keyedAnswer } from './keyed-answer'
import { everyone, fieldWorkers, office } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import {
  commissioningBody,
  commissioningList,
  commissioningQuery,
  commissioningResult,
  repairList,
  seasonGlance,
  seasonStateBody,
  seasonStateResult,
  storeInspectionBody,
  takeDownBody,
  takeDownResult,
} from '../../shared/schemas/season'
import { defineRoute, type RouteDef } from '../route-table'
import { recordCommissioning, recordStoreInspection } from '../services/commissioning'
import { listCommissionings } from '../services/commissioning-records'
import { listRepairs, recordTakeDown } from '../services/take-down'
import { seasonGlance as loadGlance, setSeasonState } from '../services/season'

const replayNote = '; a repeated Idempotency-Key answers 200 with the first record'

export const seasonRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/strings/:id/commissioning',
    access: fieldWorkers,
    tag: 'season',
    summary: `Commission a string (fixing approval, clearance, insulation and RCD readings, lamps out at switch-on); 409 when its column or anchor has no current structural approval${replayNote}`,
    idempotency: 'required',
    params: idParam,
    body: commissioningBody,
    response: commissioningResult,
    status: 201,
    handler: ({ deps, res, params, body, user, idempotencyKey }) =>
      keyedAnswer(res, recordCommissioning(deps.db, user, idempotencyKey, params.id, body)),
  }),
  defineRoute({
    method: 'post',
    path: '/strings/:id/store-inspection',
    access: fieldWorkers,
    tag: 'season',
    summary: `Pre-season inspection in store (the commissioning readings); a pass clears the string to in_store${replayNote}`,
    idempotency: 'required',
    params: idParam,
    body: storeInspectionBody,
    response: commissioningResult,
    status: 201,
    handler: ({ deps, res, params, body, user, idempotencyKey }) =>
      keyedAnswer(res, recordStoreInspection(deps.db, user, idempotencyKey, params.id, body)),
  }),
  defineRoute({
    method: 'post',
    path: '/strings/:id/take-down',
    access: fieldWorkers,
    tag: 'season',
    summary: `Take a string down into a store bin with its condition; marked for repair it goes on the repair list${replayNote}`,
    idempotency: 'required',
    params: idParam,
    body: takeDownBody,
    response: takeDownResult,
    status: 201,
    handler: ({ deps, res, params, body, user, idempotencyKey }) =>
      keyedAnswer(res, recordTakeDown(deps.db, user, idempotencyKey, params.id, body)),
  }),
  defineRoute({
    method: 'put',
    path: '/strings/:id/season-state',
    access: fieldWorkers,
    tag: 'season',
    summary:
      'Mark a string in service (409 without a passed commissioning since it went up) or back to installed',
    params: idParam,
    body: seasonStateBody,
    response: seasonStateResult,
    handler: ({ deps, params, body }) => setSeasonState(deps.db, params.id, body.state),
  }),
  defineRoute({
    method: 'get',
    path: '/commissionings',
    access: office,
    tag: 'season',
    summary: 'Commissioning records and store inspections, newest first',
    query: commissioningQuery,
    response: commissioningList,
    handler: ({ deps, query }) => listCommissionings(deps.db, query),
  }),
  defineRoute({
    method: 'get',
    path: '/season/repairs',
    access: everyone,
    tag: 'season',
    summary: 'The repair list: strings marked for repair at take-down, with what was found',
    response: repairList,
    handler: ({ deps }) => listRepairs(deps.db),
  }),
  defineRoute({
    method: 'get',
    path: '/season/glance',
    access: office,
    tag: 'season',
    summary: "The season at a glance: each client's strings by season state",
    response: seasonGlance,
    handler: ({ deps }) => loadGlance(deps.db),
  }),
]
