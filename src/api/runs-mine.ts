import type { z } from 'zod'
import type { myRun, runStop, crewRun } from '../../shared/schemas/runs'
import { http } from './http'

export type MyRun = z.infer<typeof myRun>
export type CrewRun = z.infer<typeof crewRun>
export type RunStop = z.infer<typeof runStop>

export const runsMineApi = {
  /** The signed-in crew's published run; without a date the server's today. */
  get: (date?: string, signal?: AbortSignal) => http.get<MyRun>('/runs/mine', { date }, signal),
}
