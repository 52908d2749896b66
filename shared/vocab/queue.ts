// The kinds of work in the queue and their words; schemas/queue.ts builds the API's schemas from these.
import { statusLabel, type StringStatus } from './string-states'

export const queueKinds = [
  'replace_now',
  'dark',
  'forecast_dark',
  'public_report',
  'certificate_due',
  'rcd_failed',
  'installation',
  'take_down',
] as const
export type QueueKind = (typeof queueKinds)[number]
export const queueKindLabel: Record<QueueKind, string> = {
  replace_now: statusLabel.replace,
  dark: 'Dark string',
  forecast_dark: 'Forecast to go dark',
  public_report: 'Public report',
  certificate_due: 'Certificate due',
  rcd_failed: 'RCD test failed',
  installation: 'Installation',
  take_down: 'Take-down',
}

/** The kind of item a string in this state needs; the other states need none. */
export const stringStatusKind = { replace: 'replace_now', dark: 'dark' } as const satisfies Partial<
  Record<StringStatus, QueueKind>
>

/** Items a page of the queue holds at most, and by default (schemas/queue-page.ts). */
export const QUEUE_PAGE_MAX = 100
export const QUEUE_PAGE_DEFAULT = 50
