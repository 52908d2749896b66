import { idParam } from '../../shared/schemas/common'
import { inviteBody, userList, userPatch, userResponse } from '../../shared/schemas/auth'
import { defineRoute, type RouteDef } from '../route-table'
import { inviteUser, listUsers, updateUser } from '../services/users'
import { audit } from '../services/audit'
import { inviteMail } from '../mail/templates'

export const userRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/users',
    access: ['admin'],
    tag: 'users',
    summary: 'All users',
    response: userList,
    handler: async ({ deps }) => ({ items: await listUsers(deps.db) }),
  }),
  defineRoute({
    method: 'post',
    path: '/users',
    access: ['admin'],
    tag: 'users',
    summary: 'Invite a user by e-mail',
    body: inviteBody,
    response: userResponse,
    status: 201,
    handler: async ({ body, deps, user, req }) => {
      const { user: invited, token } = await inviteUser(deps.db, body)
      await deps.mailer.send(inviteMail(deps.config, invited, token, user.name))
      await audit(deps.db, {
        userId: user.id,
        action: 'invite',
        entity: 'user',
        entityId: invited.id,
        details: { role: body.role },
        requestId: String(req.id),
      })
      return { user: invited }
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/users/:id',
    access: ['admin'],
    tag: 'users',
    summary: 'Change role or deactivate',
    params: idParam,
    body: userPatch,
    response: userResponse,
    handler: async ({ params, body, deps, user, req }) => {
      const updated = await updateUser(deps.db, user.id, params.id, body)
      await audit(deps.db, {
        userId: user.id,
        action: 'update',
        entity: 'user',
        entityId: params.id,
        details: body,
        requestId: String(req.id),
      })
      return { user: updated }
    },
  }),
]
