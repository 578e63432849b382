import type { AppContext } from '../context.js'
import { AppError } from '../errors.js'
import { defineRoutes } from '../http/routeTable.js'

export default (ctx: AppContext) =>
  defineRoutes('/health', [
    {
      method: 'get',
      path: '/',
      access: 'public',
      handler: async () => {
        try {
          await ctx.ds.query('SELECT 1')
        } catch {
          throw new AppError(503, 'db_unavailable', 'The database is not answering.')
        }
        return { status: 'ok', database: 'ok', time: new Date().toISOString() }
      },
    },
  ])
