// How a crew's emergency stop ended, in the crew's words; schemas/report-work.ts builds the log's schema
// from these.

export const emergencyOutcomes = ['fixed', 'made_safe', 'not_safe'] as const
export type EmergencyOutcome = (typeof emergencyOutcomes)[number]
export const emergencyOutcomeLabel: Record<EmergencyOutcome, string> = {
  fixed: 'Made safe and fixed: nothing left to do',
  made_safe: 'Made safe, needs more work',
  not_safe: 'Not made safe yet: still a hazard',
}
