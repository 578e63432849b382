// The warehouses as picking sees them: walking path (edited on the warehouse's own settings) and open lists.
import type { AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { listWalkWarehouses } from '../services/picking/pickWalk.js'

export default (ctx: AppContext) =>
  defineRoutes('/picking', [
    { method: 'get', path: '/warehouses', access: allow('admin', 'counter', 'warehouse'), handler: () => listWalkWarehouses(ctx.ds.manager) },
  ])
