// In-app notices: every signed-in user reads and marks only their own.
import { everyone } from '../../shared/roles'
import { noticesPage, noticesQuery, noticesReadBody, noticesReadResponse } from '../../shared/schemas/notices'
import { defineRoute, type RouteDef } from '../route-table'
import { listNotices, markRead } from '../services/notices'

export const noticeRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/notices',
    access: everyone,
    tag: 'notices',
    summary: 'My notices, newest first, paged, with the unread count',
    query: noticesQuery,
    response: noticesPage,
    handler: ({ deps, user, query }) => listNotices(deps.db, user.id, query),
  }),
  defineRoute({
    method: 'post',
    path: '/notices/read',
    access: everyone,
    tag: 'notices',
    summary: 'Mark my notices read: the given ids, or all of them with { all: true }',
    body: noticesReadBody,
    response: noticesReadResponse,
    handler: ({ deps, user, body }) => markRead(deps.db, user.id, body),
  }),
]
