// Lamp and spares stock. Crews read, load and correct only their own van (services/stock-access.ts);
// planners see and move everything; levels, usage and the order list are office work.
import { planners, stockUsers } from '../../shared/roles'
import {
  adjustmentBody,
  adjustmentResult,
  loadOut,
  loadOutQuery,
  lowLevelBody,
  orderList as orderListSchema,
  stockLine,
  stockList,
  stockQuery,
  transferBody,
  transferResult,
  usageQuery,
  usageResult,
} from '../../shared/schemas/stock'
import { defineRoute, type RouteDef } from '../route-table'
import { adjustStock, listStock, setLowLevel, transferStock } from '../services/stock'
import { orderList, usageReport } from '../services/stock-usage'
import { loadOutSheet } from '../services/stock-forecast'
import { readScope } from '../services/stock-access'
import { addDays, localToday } from '../../shared/local-time'
import { nowOf } from '../deps'
import { badRequest } from '../errors'

export const stockRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/stock',
    access: stockUsers,
    tag: 'stock',
    summary: 'Counts of each item at the depot and in each van (a crew member: their own van only)',
    query: stockQuery,
    response: stockList,
    handler: ({ deps, query, user }) => listStock(deps.db, user, query),
  }),
  defineRoute({
    method: 'post',
    path: '/stock/transfers',
    access: stockUsers,
    tag: 'stock',
    summary: 'Move stock between places; 409 stock_insufficient when the source would go below zero',
    body: transferBody,
    response: transferResult,
    status: 201,
    handler: ({ deps, body, user, req }) => transferStock(deps.db, user, body, String(req.id)),
  }),
  defineRoute({
    method: 'post',
    path: '/stock/adjustments',
    access: stockUsers,
    tag: 'stock',
    summary: 'Correct a count to what was found, with the reason',
    body: adjustmentBody,
    response: adjustmentResult,
    status: 201,
    handler: ({ deps, body, user, req }) => adjustStock(deps.db, user, body, String(req.id)),
  }),
  defineRoute({
    method: 'put',
    path: '/stock/low-levels',
    access: planners,
    tag: 'stock',
    summary: 'Set (or clear with null) the low-stock level of an item at a place',
    body: lowLevelBody,
    response: stockLine,
    handler: ({ deps, body, user, req }) => setLowLevel(deps.db, user.id, body, String(req.id)),
  }),
  defineRoute({
    method: 'get',
    path: '/stock/usage',
    access: planners,
    tag: 'stock',
    summary: 'Lamps and spares fitted by visits, by client and item, over local days from–to',
    query: usageQuery,
    response: usageResult,
    handler: ({ deps, query }) => usageReport(deps.db, query, deps.config.APP_TIME_ZONE),
  }),
  defineRoute({
    method: 'get',
    path: '/stock/order-list',
    access: planners,
    tag: 'stock',
    summary: "Next season's order: use over from–to plus known needs, less what is on hand",
    query: usageQuery,
    response: orderListSchema,
    handler: ({ deps, query }) => orderList(deps.db, query, deps.config.APP_TIME_ZONE),
  }),
  defineRoute({
    method: 'get',
    path: '/stock/load-out',
    access: stockUsers,
    tag: 'stock',
    summary: "A van's load-out sheet: its run's forecast use by class against the van (default tomorrow)",
    query: loadOutQuery,
    response: loadOut,
    handler: ({ deps, query, user }) => {
      const crewId = readScope(user, { crewId: query.crewId }) ?? query.crewId
      if (!crewId) throw badRequest('crew_required', 'Choose a crew.')
      const date = query.date ?? addDays(localToday(deps.config.APP_TIME_ZONE, nowOf(deps)), 1)
      return loadOutSheet(deps.db, crewId, date)
    },
  }),
]
