import { z } from 'zod'
import {
  CERTIFICATE_DOCUMENT_FIELD,
  CERTIFICATE_DOCUMENT_MAX_MB,
  certificateDocumentTypes,
  certificateKinds,
  subjectTypes,
} from '../vocab/certificates'

/** `general`: no intentional delay; `S`: time-delayed (selective). */
export const rcdTypes = ['general', 'S'] as const

export const certificateQuery = z.object({
  kind: z.enum(certificateKinds).optional(),
  due: z.enum(['overdue', 'soon', 'failed', 'all']).default('all'),
  limit: z.coerce.number().int().min(1).max(2000).default(500),
})

export const certificateRow = z.object({
  id: z.number(),
  kind: z.enum(certificateKinds),
  subjectType: z.enum(subjectTypes),
  subjectId: z.number(),
  subjectLabel: z.string(),
  reference: z.string().nullable(),
  doneOn: z.string(),
  nextDue: z.string().nullable(),
  result: z.enum(['pass', 'fail', 'advisory']),
  inspector: z.string().nullable(),
  readings: z.record(z.string(), z.unknown()).nullable(),
  notes: z.string().nullable(),
  daysToDue: z.number().nullable(),
  /** The certificate's document (the newest upload), fetched from /certificates/{id}/document. */
  document: z
    .object({ name: z.string(), contentType: z.string(), sizeBytes: z.number(), uploadedAt: z.string() })
    .nullable(),
  /** A circuit subject's facts, so a new test starts from them; null for other subjects. */
  circuit: z
    .object({ supplyVolts: z.number(), rcdMa: z.number().nullable(), rcdType: z.enum(rcdTypes) })
    .nullable(),
})
export const certificateList = z.object({ items: z.array(certificateRow) })

// RCD readings are checked against BS EN 61008-1 / 61009-1 and BS 7671 reg 415.1.1 (trade-reference §5);
// insulation against BS 7671 Table 64 by the circuit's voltage (shared/test-limits.ts).
export const readingsSchema = z.object({
  ratedMa: z.number().positive().max(3000).optional(),
  /** Absent: the circuit's RCD type when the subject is a circuit, else general. */
  rcdType: z.enum(rcdTypes).optional(),
  /** ½ × IΔn: true = did not trip (as it must), false = tripped; absent = not tested. */
  noTripAtHalf: z.boolean().optional(),
  tripMsAt1x: z.number().min(0).max(5000).optional(),
  tripMsAt2x: z.number().min(0).max(5000).optional(),
  tripMsAt5x: z.number().min(0).max(5000).optional(),
  /** Standing leakage on the circuit with its load on, mA (earth-leakage clamp). */
  leakageMa: z.number().min(0).max(3000).optional(),
  testVolts: z.number().positive().max(5000).optional(),
  megohms: z.number().min(0).max(100000).optional(),
  /** Nominal voltage of the circuit, V AC; absent: the circuit's supply when the subject is a circuit. */
  circuitVolts: z.number().int().min(1).max(1000).optional(),
  proofLoadKn: z.number().min(0).max(1000).optional(),
  safeWorkingLoadKg: z.number().min(0).max(10000).optional(),
})

export const certificateBody = z.object({
  kind: z.enum(certificateKinds),
  subjectType: z.enum(subjectTypes),
  subjectId: z.number().int().positive(),
  reference: z.string().trim().max(60).optional(),
  doneOn: z.iso.date(),
  nextDue: z.iso.date().optional(),
  inspector: z.string().trim().max(120).optional(),
  readings: readingsSchema.optional(),
  result: z.enum(['pass', 'fail', 'advisory']).optional(),
  notes: z.string().trim().max(1000).optional(),
})
export const findingSchema = z.object({
  code: z.string(),
  level: z.enum(['fail', 'advisory', 'note']),
  text: z.string(),
})
export const certificateCreated = z.object({
  id: z.number(),
  result: z.enum(['pass', 'fail', 'advisory']),
  reasons: z.array(z.string()),
  /** The same reasons with stable codes and how much each weighs. */
  findings: z.array(findingSchema),
})

/**
 * Days before expiry at which a certificate comes into the queue and the safety officers are e-mailed
 * (a first notice a month ahead, a second a fortnight ahead: common practice, no source). A third
 * e-mail goes on the day it expires.
 */
export const CERTIFICATE_NOTICE_DAYS = [30, 14] as const
export const reminderStages = ['days_30', 'days_14', 'expired'] as const
export type ReminderStage = (typeof reminderStages)[number]

/** Which notice a certificate with `daysLeft` to its next due date has reached; null: none yet. */
export function reminderStage(daysLeft: number): ReminderStage | null {
  if (daysLeft <= 0) return 'expired'
  if (daysLeft <= CERTIFICATE_NOTICE_DAYS[1]) return 'days_14'
  if (daysLeft <= CERTIFICATE_NOTICE_DAYS[0]) return 'days_30'
  return null
}

/** Finding a subject to record its first certificate: by asset tag, reference or name. */
export const subjectQuery = z.object({
  q: z.string().trim().min(1).max(60),
  subjectType: z.enum(subjectTypes).optional(),
})
export const subjectList = z.object({
  items: z.array(z.object({ subjectType: z.enum(subjectTypes), subjectId: z.number(), label: z.string() })),
})

/** A certificate's document: the multipart field, its largest size and types are in ../vocab/certificates.ts. */
export const certificateDocumentBody = z.object({
  [CERTIFICATE_DOCUMENT_FIELD]: z
    .unknown()
    .optional()
    .meta({
      type: 'string',
      format: 'binary',
      description: `PDF, JPEG or PNG (checked by its bytes), at most ${CERTIFICATE_DOCUMENT_MAX_MB} MB.`,
    }),
})
export const certificateDocumentSaved = z.object({
  name: z.string(),
  contentType: z.enum(certificateDocumentTypes),
  sizeBytes: z.number(),
  uploadedAt: z.string(),
})
