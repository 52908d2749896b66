import type { z } from 'zod'
import type { crewList, myRun, planBody, publishBody, runsList } from '../../shared/schemas/runs'
import type { CrewRun, PlanResultView, RunStop } from '../../shared/schemas/runs'
import { http } from './http'

export type { CrewRun, RunStop }
export type PlanResult = PlanResultView
export type PlanInput = z.input<typeof planBody>
export type PublishInput = z.input<typeof publishBody>
export type Crew = z.infer<typeof crewList>['items'][number]
export type RunsOfDay = z.infer<typeof runsList>
export type MyRun = z.infer<typeof myRun>

export const runsApi = {
  crews: () => http.get<{ items: Crew[] }>('/crews'),
  /** A proposal only: nothing is saved until `publish`. */
  plan: (input: PlanInput) => http.post<PlanResult>('/runs/plan', input),
  /** Saves each run in the order given and e-mails every member of each crew. */
  publish: (input: PublishInput) => http.post<PlanResult>('/runs/publish', input),
  published: (date: string) => http.get<RunsOfDay>('/runs', { date }),
  /** The signed-in crew's published run; without a date the server's today. */
  mine: (date?: string, signal?: AbortSignal) => http.get<MyRun>('/runs/mine', { date }, signal),
}
