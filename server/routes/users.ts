import { admins } from '../../shared/roles'
import { idParam } from '../../shared/schemas/common'
import { inviteBody, userList, userPatch, userResponse } from '../../shared/schemas/auth'
import { defineRoute, type RouteDef } from '../route-table'
import { inviteUser, listUsers, updateUser } from '../services/users'
import { renewInvite } from '../services/invites'
import { audited } from '../services/audit'
import { inviteMail } from '../mail/templates'

export const userRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/users',
    access: admins,
    tag: 'users',
    summary: 'All users',
    response: userList,
    handler: async ({ deps }) => ({ items: await listUsers(deps.db) }),
  }),
  defineRoute({
    method: 'post',
    path: '/users',
    access: admins,
    tag: 'users',
    summary: 'Invite a user by e-mail',
    body: inviteBody,
    response: userResponse,
    status: 201,
    handler: async ({ body, deps, user, req }) => {
      const {
        user: invited,
        token,
        expiresAt,
      } = await audited(
        deps.db,
        (trx) => inviteUser(trx, body),
        (r) => ({
          userId: user.id,
          action: 'invite',
          entity: 'user',
          entityId: r.user.id,
          details: { role: body.role },
          requestId: String(req.id),
        }),
      )
      // Sent after the commit: no invitation mail for a user that was never saved.
      await deps.mailer.send(inviteMail(deps.config, invited, token, user.name, expiresAt))
      return { user: invited }
    },
  }),
  defineRoute({
    method: 'post',
    path: '/users/:id/invite',
    access: admins,
    tag: 'users',
    summary: 'Send the invitation again with a new link (the old one stops working)',
    params: idParam,
    response: userResponse,
    handler: async ({ params, deps, user, req }) => {
      const {
        user: invited,
        token,
        expiresAt,
      } = await audited(
        deps.db,
        (trx) => renewInvite(trx, params.id),
        () => ({
          userId: user.id,
          action: 'invite_resend',
          entity: 'user',
          entityId: params.id,
          requestId: String(req.id),
        }),
      )
      await deps.mailer.send(inviteMail(deps.config, invited, token, user.name, expiresAt))
      return { user: invited }
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/users/:id',
    access: admins,
    tag: 'users',
    summary: 'Change role or deactivate',
    params: idParam,
    body: userPatch,
    response: userResponse,
    handler: async ({ params, body, deps, user, req }) => {
      const updated = await audited(
        deps.db,
        (trx) => updateUser(trx, user.id, params.id, body),
        () => ({
          userId: user.id,
          action: 'update',
          entity: 'user',
          entityId: params.id,
          details: body,
          requestId: String(req.id),
        }),
      )
      return { user: updated }
    },
  }),
]
