// Scheduled jobs an admin can run at once: the same run as the schedule's, behind the same lock.
import { z } from 'zod'
import { admins } from '../../shared/roles'
import { defineRoute, type RouteDef } from '../route-table'
import { conflict, HttpError } from '../errors'
import { audit } from '../services/audit'
import { isJobName, jobNames, runJob } from '../jobs/run-job'
import { nowOf } from '../deps'

const jobParams = z.object({ name: z.string().max(60) })

const jobRun = z.object({
  job: z.enum(jobNames),
  startedAt: z.string(),
  finishedAt: z.string(),
  result: z.unknown(),
})

export const adminJobRoutes: RouteDef[] = [
  defineRoute({
    method: 'post',
    path: '/admin/jobs/:name/run',
    access: admins,
    tag: 'settings',
    summary: `Run a scheduled job now (${jobNames.join(', ')}); 409 job_running while another process runs it`,
    params: jobParams,
    response: jobRun,
    handler: async ({ deps, params, user, req }) => {
      const name = params.name
      if (!isJobName(name))
        throw new HttpError(
          404,
          'unknown_job',
          `There is no job called "${name}". Jobs: ${jobNames.join(', ')}.`,
        )
      const startedAt = nowOf(deps)
      const run = await runJob(name, deps, startedAt)
      if (!run.ran) throw conflict('job_running', 'This job is running now elsewhere; try again in a minute.')
      await audit(deps.db, {
        userId: user.id,
        action: 'run',
        entity: 'job',
        details: { job: name, result: run.result },
        requestId: String(req.id),
      })
      return {
        job: name,
        startedAt: startedAt.toISOString(),
        finishedAt: new Date().toISOString(),
        result: run.result,
      }
    },
  }),
]
