// The start page's day at a glance: one answer for the signed-in person's roles (a panel per role).
import { ANYONE_SIGNED_IN } from '../../shared/roles.js'
import { todayQuerySchema } from '../../shared/schemas/today.js'
import type { AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { readSource } from '../http/readSource.js'
import { defineRoutes } from '../http/routeTable.js'
import { parseQuery } from '../http/validate.js'
import { todayFigures } from '../services/today/todayFigures.js'

export default (ctx: AppContext) =>
  defineRoutes('/today', [
    {
      method: 'get', path: '/', access: { roles: ANYONE_SIGNED_IN },
      handler: (req) => {
        if (!req.user) throw AppError.unauthenticated()
        return todayFigures(readSource(ctx), req.user.roles, parseQuery(todayQuerySchema, req.query))
      },
    },
  ])
