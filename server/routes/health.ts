import type { AppContext } from '../context.js'
import { defineRoutes } from '../http/routeTable.js'
import { databaseHealth } from '../services/healthService.js'

export default (ctx: AppContext) =>
  defineRoutes('/health', [{ method: 'get', path: '/', access: 'public', handler: () => databaseHealth(ctx.ds) }])
