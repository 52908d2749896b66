// The reporter's words on the work (queue item, run stop, string page) and the crew's log of an
// emergency stop. Nothing personal: a report note never carries the reporter's name or address.
import { z } from 'zod'
import { emergencyOutcomes } from '../vocab/report-work'

/** A waiting public report as crews and supervisors see it. */
export const reportNote = z.object({
  ref: z.string(),
  hazard: z.boolean(),
  description: z.string(),
  /** The reporter's "near" (a landmark), and the street they named. */
  near: z.string().nullable(),
  street: z.string().nullable(),
  createdAt: z.string(),
  photo: z.object({ url: z.string(), thumbUrl: z.string() }).nullable(),
})
export type ReportNote = z.infer<typeof reportNote>

/**
 * Emergency items come before every other item, whatever the score: the score is at most 100
 * (score.ts), so adding this lifts every emergency above every routine item in the queue and the
 * planner (common practice, no source: a reported hazard is attended first).
 */
export const EMERGENCY_RANK = 1000
export const rankPriority = (i: { severity: string; score: number }) =>
  (i.severity === 'emergency' ? EMERGENCY_RANK : 0) + i.score
/** Emergency first, then score, highest first. */
export const byRank = (a: { severity: string; score: number }, b: { severity: string; score: number }) =>
  rankPriority(b) - rankPriority(a)

export const emergencyLogBody = z.object({
  found: z.string().trim().min(3, 'Say what you found.').max(2000),
  did: z.string().trim().min(3, 'Say what you did.').max(2000),
  outcome: z.enum(emergencyOutcomes),
  /** When the work was done, from the phone (a log sent later from the outbox keeps its time). */
  loggedAt: z.iso.datetime({ offset: true }).optional(),
})
export type EmergencyLogBody = z.infer<typeof emergencyLogBody>

export const emergencyLog = z.object({
  id: z.number(),
  itemId: z.number().nullable(),
  stringId: z.number().nullable(),
  by: z.string().nullable(),
  found: z.string(),
  did: z.string(),
  outcome: z.enum(emergencyOutcomes),
  outcomeLabel: z.string(),
  loggedAt: z.string(),
  photo: z.object({ url: z.string(), thumbUrl: z.string() }).nullable(),
  /** Whether the queue item closed with this log. */
  itemClosed: z.boolean(),
})
export type EmergencyLog = z.infer<typeof emergencyLog>

/** What a string's page adds about public work: reports still waiting and the emergency logs. */
export const stringWorkNotes = z.object({
  reports: z.array(reportNote),
  emergencyLogs: z.array(emergencyLog),
})
export type StringWorkNotes = z.infer<typeof stringWorkNotes>

export const reportPhotoBody = z.object({
  /** The one-time key the report's answer gave; a multipart text field beside the file. */
  photoKey: z.string().trim().min(20).max(100),
  photo: z.unknown().optional().meta({ type: 'string', format: 'binary', description: 'JPEG, PNG or WebP.' }),
})
export const reportPhotoResult = z.object({ ref: z.string(), photo: z.boolean() })
export const emergencyPhotoBody = z.object({
  photo: z.unknown().optional().meta({ type: 'string', format: 'binary', description: 'JPEG, PNG or WebP.' }),
})
