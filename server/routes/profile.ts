import { passwordChangeSchema, profileUpdateSchema } from '../../shared/schemas/auth.js'
import { ANYONE_SIGNED_IN } from '../../shared/roles.js'
import { actorOf, type AppContext } from '../context.js'
import { logIn } from '../http/session.js'
import { defineRoutes } from '../http/routeTable.js'
import { parseBody } from '../http/validate.js'
import { changePassword, ownUser, updateProfile } from '../services/userService.js'

const signedIn = { roles: ANYONE_SIGNED_IN }

export default (ctx: AppContext) =>
  defineRoutes('/profile', [
    { method: 'get', path: '/', access: signedIn, handler: (req) => ({ user: req.user }) },
    {
      method: 'patch',
      path: '/',
      access: signedIn,
      handler: async (req) => ({ user: await updateProfile(ctx.ds, actorOf(req).userId, parseBody(profileUpdateSchema, req.body)) }),
    },
    {
      method: 'post',
      path: '/password',
      access: signedIn,
      handler: async (req) => {
        const input = parseBody(passwordChangeSchema, req.body)
        await changePassword(ctx.ds, actorOf(req), input.currentPassword, input.newPassword)
        // Other sessions end (the epoch moved); this one continues on a fresh id.
        const user = await ownUser(ctx.ds, actorOf(req).userId)
        const signedInAt = req.session.signedInAt
        await logIn(req, user)
        req.session.signedInAt = signedInAt
        return { ok: true }
      },
    },
  ])
