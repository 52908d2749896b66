import { planners, queueReaders } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import { closeBody, mergeBody, refreshResult, snoozeBody, wakeResult } from '../../shared/schemas/queue'
import { defineRoute, type RouteDef } from '../route-table'
import { closeItem, mergeItems, snoozeItem, wakeItem } from '../services/queue/actions'
import { listQueuePage } from '../services/queue/list'
import { queuePage, queuePageQuery } from '../../shared/schemas/queue-page'
import { refreshQueue } from '../jobs/refresh-queue'
import { safetyQueuePage } from '../services/certificate-queue'
import { audited } from '../services/audit'

export const queueRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/queue',
    access: queueReaders,
    tag: 'queue',
    summary:
      'Work queue ranked by priority score (emergencies first), with filters, one page at a time; safety officers see certificate work only (403 for other kinds)',
    query: queuePageQuery,
    response: queuePage,
    handler: async ({ deps, query, user }) => ({
      ...(user.role === 'safety'
        ? await safetyQueuePage(deps.db, query)
        : await listQueuePage(deps.db, query)),
      page: query.page,
      pageSize: query.pageSize,
      refreshedAt: new Date().toISOString(),
    }),
  }),
  defineRoute({
    method: 'post',
    path: '/queue/refresh',
    access: planners,
    tag: 'queue',
    summary: 'Rebuild the queue from strings, reports and certificates now',
    response: refreshResult,
    handler: ({ deps }) => refreshQueue(deps.db),
  }),
  defineRoute({
    method: 'post',
    path: '/queue/:id/snooze',
    access: planners,
    tag: 'queue',
    summary: 'Snooze an item until a time, with a reason',
    params: idParam,
    body: snoozeBody,
    handler: async ({ deps, params, body, user, req }) => {
      await audited(
        deps.db,
        (trx) => snoozeItem(trx, params.id, new Date(body.until), body.reason),
        () => ({
          userId: user.id,
          action: 'snooze',
          entity: 'queue_item',
          entityId: params.id,
          details: body,
          requestId: String(req.id),
        }),
      )
    },
  }),
  defineRoute({
    method: 'post',
    path: '/queue/:id/wake',
    access: planners,
    tag: 'queue',
    summary: 'Wake a snoozed item early: it is open again now (409 if it is not snoozed)',
    params: idParam,
    response: wakeResult,
    handler: ({ deps, params, user, req }) =>
      audited(
        deps.db,
        (trx) => wakeItem(trx, params.id),
        () => ({
          userId: user.id,
          action: 'wake',
          entity: 'queue_item',
          entityId: params.id,
          requestId: String(req.id),
        }),
      ),
  }),
  defineRoute({
    method: 'post',
    path: '/queue/merge',
    access: planners,
    tag: 'queue',
    summary: 'Merge items into one (duplicates of the same fault)',
    body: mergeBody,
    handler: async ({ deps, body, user, req }) => {
      await audited(
        deps.db,
        (trx) => mergeItems(trx, body.into, body.ids),
        () => ({
          userId: user.id,
          action: 'merge',
          entity: 'queue_item',
          entityId: body.into,
          details: body,
          requestId: String(req.id),
        }),
      )
    },
  }),
  defineRoute({
    method: 'post',
    path: '/queue/:id/close',
    access: planners,
    tag: 'queue',
    summary: "Close an item without a visit, with a reason; a public report's status moves on with it",
    params: idParam,
    body: closeBody,
    handler: async ({ deps, params, body, user, req }) => {
      await audited(
        deps.db,
        (trx) => closeItem(trx, params.id, body.reason, body.reportState),
        () => ({
          userId: user.id,
          action: 'close',
          entity: 'queue_item',
          entityId: params.id,
          details: body,
          requestId: String(req.id),
        }),
      )
    },
  }),
]
