import { signInSchema } from '../../shared/schemas/auth.js'
import { ANYONE_SIGNED_IN } from '../../shared/roles.js'
import type { AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { authenticate, logIn, logOut } from '../http/session.js'
import { defineRoutes } from '../http/routeTable.js'
import { parseBody } from '../http/validate.js'
import { auditSignIn } from '../services/auditService.js'
import { recordSignIn, toSessionUser } from '../services/userService.js'

export default (ctx: AppContext) =>
  defineRoutes('/session', [
    {
      method: 'post',
      path: '/',
      access: 'public',
      handler: async (req, res) => {
        const input = parseBody(signInSchema, req.body)
        const ip = req.ip ?? 'unknown'
        // The attempt is counted before the password is checked (atomic in the database), so a burst
        // of parallel guesses gets no more checks than the limit.
        try {
          await ctx.throttle.reserve(input.username, ip)
        } catch (err) {
          if (err instanceof AppError) await auditSignIn(ctx.ds, 'session.sign_in_refused', { username: input.username, ip }, { reason: err.code })
          throw err
        }
        req.body = { username: input.username.toLowerCase(), password: input.password }
        const user = await authenticate(ctx.passport, req, res)
        if (!user) {
          await auditSignIn(ctx.ds, 'session.sign_in_failed', { username: input.username, ip })
          throw new AppError(401, 'bad_credentials', 'The user name or password is not right.')
        }
        await ctx.throttle.succeeded(input.username, ip)
        await logIn(req, user) // passport 0.7 regenerates the session id here
        req.session.signedInAt = Date.now()
        await recordSignIn(ctx.ds, user.id)
        await auditSignIn(ctx.ds, 'session.sign_in', { username: user.username, userId: user.id, ip })
        return { user: toSessionUser(user) }
      },
    },
    {
      method: 'get',
      path: '/',
      access: 'public', // the client asks at start-up; signed out is an answer, not an error
      handler: (req) => ({ user: req.user ?? null, demo: ctx.config.env !== 'production' }),
    },
    {
      method: 'delete',
      path: '/',
      access: { roles: ANYONE_SIGNED_IN },
      handler: async (req, res) => {
        const who = req.user
        await logOut(req)
        if (who) await auditSignIn(ctx.ds, 'session.sign_out', { username: who.username, userId: who.id, ip: req.ip ?? null })
        res.clearCookie('lumenyard.sid')
        res.status(204).end()
      },
    },
  ])
