import { planners } from '../../shared/roles'
import {
  crewList,
  myRun,
  planBody,
  planResult,
  publishBody,
  runsList,
  runsQuery,
} from '../../shared/schemas/runs'
import { defineRoute, type RouteDef } from '../route-table'
import { loadCrews } from '../services/run-items'
import { proposePlan, publishRuns } from '../services/runs'
import { listRuns } from '../services/run-list'
import { badRequest } from '../errors'

const today = () => new Date().toISOString().slice(0, 10)

export const runRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/crews',
    access: ['supervisor', 'manager', 'admin', 'safety'],
    tag: 'runs',
    summary: 'Crews with depot, shift, platform and members',
    response: crewList,
    handler: async ({ deps }) => ({ items: await loadCrews(deps.db) }),
  }),
  defineRoute({
    method: 'post',
    path: '/runs/plan',
    access: planners,
    tag: 'runs',
    summary: 'Propose runs: assign queue items to crews and order them (not saved)',
    body: planBody,
    response: planResult,
    handler: ({ deps, body, user, res }) => proposePlan(deps.db, body, deps.config, { userId: user.id, res }),
  }),
  defineRoute({
    method: 'post',
    path: '/runs/publish',
    access: planners,
    tag: 'runs',
    summary: 'Publish runs in the given order and e-mail each crew',
    body: publishBody,
    response: planResult,
    handler: ({ deps, body, user, req, res }) =>
      publishRuns(deps.db, deps.mailer, deps.config, user.id, body, {
        requestId: String(req.id),
        owner: { userId: user.id, res },
      }),
  }),
  defineRoute({
    method: 'get',
    path: '/runs',
    access: planners,
    tag: 'runs',
    summary: 'Published runs for a date',
    query: runsQuery,
    response: runsList,
    handler: async ({ deps, query }) => ({
      date: query.date ?? today(),
      runs: await listRuns(deps.db, query.date ?? today()),
    }),
  }),
  defineRoute({
    method: 'get',
    path: '/runs/mine',
    access: ['crew', 'supervisor'],
    tag: 'runs',
    summary: "The signed-in crew member's run for a date (default today)",
    query: runsQuery,
    response: myRun,
    handler: async ({ deps, query, user }) => {
      if (!user.crewId) throw badRequest('no_crew', 'You are not a member of a crew.')
      const date = query.date ?? today()
      const [run] = await listRuns(deps.db, date, user.crewId)
      return { date, run: run?.state === 'published' ? run : null }
    },
  }),
]
