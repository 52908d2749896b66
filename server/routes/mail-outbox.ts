// Mail that did not arrive, for admins: what failed and why, and a "send again".
import { admins } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import { outboxList, outboxMessageResponse } from '../../shared/schemas/mail-outbox'
import { defineRoute, type RouteDef } from '../route-table'
import { audited } from '../services/audit'
import { getOutboxMessage, listFailingMail, requeueMail } from '../services/mail'

export const mailOutboxRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/email-outbox/failing',
    access: admins,
    tag: 'system',
    summary: 'Messages that failed for good or wait to be tried again, with the last error',
    response: outboxList,
    handler: async ({ deps }) => ({ items: await listFailingMail(deps.db) }),
  }),
  defineRoute({
    method: 'post',
    path: '/email-outbox/:id/send-again',
    access: admins,
    tag: 'system',
    summary: 'Try a failed message again now, with a fresh count of attempts',
    params: idParam,
    response: outboxMessageResponse,
    handler: async ({ params, deps, user, req }) => {
      await audited(
        deps.db,
        (trx) => requeueMail(trx, params.id),
        () => ({
          userId: user.id,
          action: 'mail_send_again',
          entity: 'email',
          entityId: params.id,
          requestId: String(req.id),
        }),
      )
      await deps.mailer.deliverDue?.({ ids: [params.id] })
      return { message: await getOutboxMessage(deps.db, params.id) }
    },
  }),
]
