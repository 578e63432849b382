import { passwordResetSchema, userCreateSchema, userUpdateSchema } from '../../shared/schemas/auth.js'
import { ADMIN_ONLY } from '../../shared/roles.js'
import { actorOf, type AppContext } from '../context.js'
import { defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody } from '../http/validate.js'
import { createUser, listUsers, resetPassword, updateUser } from '../services/userService.js'

const admin = { roles: ADMIN_ONLY }

export default (ctx: AppContext) =>
  defineRoutes('/users', [
    { method: 'get', path: '/', access: admin, handler: () => listUsers(ctx.ds) },
    {
      method: 'post',
      path: '/',
      access: admin,
      status: 201,
      handler: (req) => createUser(ctx.ds, actorOf(req), parseBody(userCreateSchema, req.body)),
    },
    {
      method: 'patch',
      path: '/:id',
      access: admin,
      handler: (req) =>
        updateUser(ctx.ds, actorOf(req), idParam(req.params.id, 'user_not_found'), parseBody(userUpdateSchema, req.body)),
    },
    {
      method: 'post',
      path: '/:id/password',
      access: admin,
      handler: async (req) => {
        const { password } = parseBody(passwordResetSchema, req.body)
        await resetPassword(ctx.ds, actorOf(req), idParam(req.params.id, 'user_not_found'), password)
        return { ok: true }
      },
    },
  ])
