import type { z } from 'zod'
import type { mailList, mailMessage } from '../../shared/schemas/system'
import type { OutboxMessage } from '../../shared/schemas/mail-outbox'
import type { Id } from './auth'
import { http } from './http'

export type MailSummary = z.infer<typeof mailList>['items'][number]
export type MailMessage = z.infer<typeof mailMessage>

export const mailApi = {
  list: () => http.get<{ items: MailSummary[] }>('/mail'),
  get: (id: Id) => http.get<MailMessage>(`/mail/${id}`),
  /** Mail that did not arrive (any mode): failed for good, or waiting for another attempt. */
  failing: () => http.get<{ items: OutboxMessage[] }>('/email-outbox/failing'),
  sendAgain: (id: Id) => http.post<{ message: OutboxMessage }>(`/email-outbox/${id}/send-again`),
}

export type { OutboxMessage }
