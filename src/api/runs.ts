import type { z } from 'zod'
import type { crewList, myRun, planBody, publishBody, runsList } from '../../shared/schemas/runs'
import type { basemap } from '../../shared/schemas/system'
import type { CrewRun, PlanResultView, RunStop } from '../../shared/schemas/runs'
import { http } from './http'

export type { CrewRun, RunStop }
export type PlanResult = PlanResultView
export type PlanInput = z.input<typeof planBody>
export type PublishInput = z.input<typeof publishBody>
export type Crew = z.infer<typeof crewList>['items'][number]
export type RunsOfDay = z.infer<typeof runsList>
export type MyRun = z.infer<typeof myRun>
export type Basemap = z.infer<typeof basemap>

export const runsApi = {
  crews: () => http.get<{ items: Crew[] }>('/crews'),
  /** A proposal only: nothing is saved until `publish`. */
  plan: (input: PlanInput) => http.post<PlanResult>('/runs/plan', input),
  /** Saves each run in the order given and e-mails every member of each crew. */
  publish: (input: PublishInput) => http.post<PlanResult>('/runs/publish', input),
  published: (date: string) => http.get<RunsOfDay>('/runs', { date }),
  mine: (date: string) => http.get<MyRun>('/runs/mine', { date }),
  /** The demo town's streets, drawn under the runs when no tile server is configured. */
  basemap: () => http.get<Basemap>('/basemap'),
}
