import type { z } from 'zod'
import type { mailList, mailMessage } from '../../shared/schemas/system'
import type { Id } from './auth'
import { http } from './http'

export type MailSummary = z.infer<typeof mailList>['items'][number]
export type MailMessage = z.infer<typeof mailMessage>

export const mailApi = {
  list: () => http.get<{ items: MailSummary[] }>('/mail'),
  get: (id: Id) => http.get<MailMessage>(`/mail/${id}`),
}
