// Certificate words and lists the screens show; schemas/certificates.ts builds the API's schemas from them.

export const certificateKinds = [
  'platform_exam',
  'platform_pre_use',
  'column_structural',
  'anchor_test',
  'display_inspection',
  'rcd_test',
  'insulation_test',
] as const
export const certificateKindLabel: Record<(typeof certificateKinds)[number], string> = {
  platform_exam: 'Platform thorough examination',
  platform_pre_use: 'Platform pre-use check',
  column_structural: 'Column structural test',
  anchor_test: 'Anchor load test',
  display_inspection: 'Display in-service inspection',
  rcd_test: 'RCD test',
  insulation_test: 'Insulation resistance test',
}
export const subjectTypes = ['platform', 'structure', 'string', 'circuit'] as const
/** Which tests fit which subject: a column or anchor takes a structural test, a circuit an electrical one. */
export const kindsForSubject: Record<
  (typeof subjectTypes)[number],
  readonly (typeof certificateKinds)[number][]
> = {
  platform: ['platform_exam', 'platform_pre_use'],
  structure: ['column_structural', 'anchor_test'],
  string: ['display_inspection'],
  circuit: ['rcd_test', 'insulation_test'],
}

/** The queue kinds a safety officer sees: certificate work (due, failed tests, failed RCDs). */
export const safetyQueueKinds = ['certificate_due', 'rcd_failed'] as const

/** The multipart field of a certificate's document, its largest size and the types its bytes may be. */
export const CERTIFICATE_DOCUMENT_FIELD = 'document'
export const CERTIFICATE_DOCUMENT_MAX_MB = 10
export const certificateDocumentTypes = ['application/pdf', 'image/jpeg', 'image/png'] as const
