// Reports for the owner and the buyer (admin and buyer): what the stock was worth, read from the ledger.
// Values go out under the cost rule's names (services/costVisibility.ts), which leaves them out for
// anyone who may not see costs.
import { stockValuationQuerySchema } from '../../shared/schemas/reports.js'
import type { AppContext } from '../context.js'
import { readSource } from '../http/readSource.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { parseQuery } from '../http/validate.js'
import { stockValuation } from '../services/reports/stockValuation.js'

const owners = allow('admin', 'buyer')

export default (ctx: AppContext) =>
  defineRoutes('/reports', [
    {
      method: 'get', path: '/stock-valuation', access: owners,
      handler: (req) => stockValuation(readSource(ctx), parseQuery(stockValuationQuerySchema, req.query)),
    },
  ])
