// A public fault report's states and what each means to the person who sent it. Plain TypeScript, no
// zod, so the public report page can show them without loading a schema library (issue 14: its
// JavaScript budget); schemas/reports.ts builds the API's schemas from these.

export const reportStates = ['received', 'in_hand', 'scheduled', 'fixed', 'not_ours', 'duplicate'] as const
export type ReportState = (typeof reportStates)[number]
/** A report in one of these states has work waiting: the queue keeps an item open for it. */
export const reportOpenStates = ['received', 'in_hand', 'scheduled'] as const satisfies readonly ReportState[]
/** Where a report goes when its queue item closes. */
export const reportClosedStates = ['fixed', 'not_ours', 'duplicate'] as const satisfies readonly ReportState[]
export type ReportClosedState = (typeof reportClosedStates)[number]

export const reportStateLabel: Record<ReportState, string> = {
  received: 'Received',
  in_hand: 'A crew has it in hand',
  scheduled: 'On a crew’s list for a night',
  fixed: 'Fixed',
  not_ours: 'Not ours to fix: passed on',
  duplicate: 'Already reported',
}

/** What each state means to the person who sent the report, in one plain sentence. */
export const reportStateMeaning: Record<ReportState, string> = {
  received: 'We have your report. A supervisor will look at it and send a crew.',
  in_hand: 'A supervisor has looked at it and is planning the work.',
  scheduled: 'It is on a crew’s list for a night. Crews work after dark.',
  fixed: 'A crew has been and fixed it. Thank you for telling us.',
  not_ours: 'These lights are not ours to look after. We have passed it on.',
  duplicate: 'Someone told us about this before you. We are working from that report.',
}

export function isOpenReportState(state: string): boolean {
  return (reportOpenStates as readonly string[]).includes(state)
}
