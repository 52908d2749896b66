// What a public fault report must hold, in plain TypeScript: the report page checks its form with
// these before sending (no zod on the public pages, issue 14), and the server's zod schema
// (schemas/reports.ts) is built from the same limits, pattern and messages, so the two never differ.

/** Longest text each field keeps (characters). */
export const reportLimits = {
  tag: 40,
  street: 160,
  landmark: 160,
  description: 2000,
  name: 120,
  email: 190,
} as const

/** Fewer characters than this say nothing a crew can act on. */
export const DESCRIPTION_MIN = 5

/** References: LW- and five letters or digits. */
export const REF_PATTERN = /^LW-[0-9A-Z]{5}$/

export const reportMessages = {
  description: 'Tell us a little about the fault.',
  where: 'Give the number on the lights, the street, or your location.',
  email: 'That does not look like an e-mail address.',
  ref: 'A reference looks like LW-7K3QD.',
} as const

/** A loose shape check (something@something.tld); the server's schema checks the address fully. */
const EMAIL_SHAPE = /^[^\s@]+@[^\s@]+\.[^\s@]+$/

export interface ReportDraft {
  tag?: string
  street?: string
  description: string
  email?: string
  lat?: number
  lng?: number
}

/** The form's problems by field (`description`, `street`, `email`); empty when it may be sent. */
export function reportProblems(r: ReportDraft): Partial<Record<'description' | 'street' | 'email', string>> {
  const out: Partial<Record<'description' | 'street' | 'email', string>> = {}
  if (r.description.trim().length < DESCRIPTION_MIN) out.description = reportMessages.description
  if (!hasPlace(r)) out.street = reportMessages.where
  const email = r.email?.trim()
  if (email && !EMAIL_SHAPE.test(email)) out.email = reportMessages.email
  return out
}

/** A report must say where: the label's number, a street, or a point. */
export function hasPlace(r: Pick<ReportDraft, 'tag' | 'street' | 'lat' | 'lng'>): boolean {
  return Boolean(r.tag?.trim() || r.street?.trim() || (r.lat !== undefined && r.lng !== undefined))
}
