import { fieldWorkers, office, planners } from '../../shared/roles'
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
import { withStockWarnings } from '../services/stock-forecast'
import { askFrom } from '../services/crew-membership'
import { localToday, shiftDate } from '../../shared/local-time'
import { nowOf, type AppDeps } from '../deps'

const today = (deps: AppDeps) => localToday(deps.config.APP_TIME_ZONE, nowOf(deps))

export const runRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/crews',
    access: office,
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
      date: query.date ?? today(deps),
      // The planning board warns when a van cannot cover its run (services/stock-forecast.ts).
      runs: await withStockWarnings(deps.db, await listRuns(deps.db, query.date ?? today(deps))),
    }),
  }),
  defineRoute({
    method: 'get',
    path: '/runs/mine',
    access: fieldWorkers,
    tag: 'runs',
    summary:
      "The signed-in crew member's run for a date (default: the crew's current shift, which may have begun yesterday)",
    query: runsQuery,
    response: myRun,
    handler: async ({ deps, query, user }) => {
      // Not on a crew yet: not an error, the page says whom to ask.
      if (!user.crewId)
        return { date: query.date ?? today(deps), run: null, crew: null, askFrom: await askFrom(deps.db) }
      const [crew] = await loadCrews(deps.db, [user.crewId])
      // 00:20 on a 16:00–00:30 shift is still the previous day's run.
      const date =
        query.date ??
        shiftDate(nowOf(deps), { start: crew.shiftStart, end: crew.shiftEnd }, deps.config.APP_TIME_ZONE)
      const [run] = await listRuns(deps.db, date, user.crewId)
      return {
        date,
        run: run?.state === 'published' ? run : null,
        crew: { id: crew.id, name: crew.name },
        askFrom: [],
      }
    },
  }),
]
