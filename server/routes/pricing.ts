// Selling prices: the admin sets price levels, item price rules, the sales tax of each warehouse location
// and accounts' terms; the counter reads them and asks "how much?" for a list of items.
import { z } from 'zod'
import {
  customerTermsInputSchema,
  priceEstimateSchema,
  priceLevelInputSchema,
  priceLevelUpdateSchema,
  priceRuleInputSchema,
  priceRuleQuerySchema,
  taxRateInputSchema,
} from '../../shared/schemas/pricing.js'
import { actorOf, type AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { estimatePrices } from '../services/pricing/priceEstimate.js'
import {
  createPriceLevel,
  createPriceRule,
  customerTerms,
  deletePriceLevel,
  deletePriceRule,
  listCustomerTerms,
  listPriceLevels,
  listPriceRules,
  listTaxRates,
  setCustomerTerms,
  setTaxRate,
  updatePriceLevel,
} from '../services/pricing/priceSetup.js'

const readers = allow('admin', 'counter')
const admin = allow('admin')
const accountsQuery = z.object({ all: z.enum(['true', 'false']).default('false') })

export default (ctx: AppContext) =>
  defineRoutes('/pricing', [
    { method: 'get', path: '/levels', access: readers, handler: () => listPriceLevels(ctx.ds) },
    { method: 'post', path: '/levels', access: admin, status: 201, handler: (req) => createPriceLevel(ctx.ds, actorOf(req), parseBody(priceLevelInputSchema, req.body)) },
    {
      method: 'put',
      path: '/levels/:id',
      access: admin,
      handler: (req) => updatePriceLevel(ctx.ds, actorOf(req), idParam(req.params.id, 'price_level_not_found'), parseBody(priceLevelUpdateSchema, req.body)),
    },
    { method: 'delete', path: '/levels/:id', access: admin, handler: (req) => deletePriceLevel(ctx.ds, actorOf(req), idParam(req.params.id, 'price_level_not_found')) },
    { method: 'get', path: '/rules', access: readers, handler: (req) => listPriceRules(ctx.ds, parseQuery(priceRuleQuerySchema, req.query)) },
    { method: 'post', path: '/rules', access: admin, status: 201, handler: (req) => createPriceRule(ctx.ds, actorOf(req), parseBody(priceRuleInputSchema, req.body)) },
    { method: 'delete', path: '/rules/:id', access: admin, handler: (req) => deletePriceRule(ctx.ds, actorOf(req), idParam(req.params.id, 'price_rule_not_found')) },
    { method: 'get', path: '/tax-rates', access: readers, handler: () => listTaxRates(ctx.ds) },
    {
      method: 'put',
      path: '/tax-rates/:warehouseId',
      access: admin,
      handler: (req) => setTaxRate(ctx.ds, actorOf(req), idParam(req.params.warehouseId, 'warehouse_not_found'), parseBody(taxRateInputSchema, req.body)),
    },
    { method: 'get', path: '/accounts', access: readers, handler: (req) => listCustomerTerms(ctx.ds, parseQuery(accountsQuery, req.query).all === 'true') },
    { method: 'get', path: '/accounts/:customerId', access: readers, handler: (req) => customerTerms(ctx.ds, idParam(req.params.customerId, 'customer_not_found')) },
    {
      method: 'put',
      path: '/accounts/:customerId',
      access: admin,
      handler: (req) => setCustomerTerms(ctx.ds, actorOf(req), idParam(req.params.customerId, 'customer_not_found'), parseBody(customerTermsInputSchema, req.body)),
    },
    { method: 'post', path: '/estimate', access: readers, handler: (req) => estimatePrices(ctx.ds, parseBody(priceEstimateSchema, req.body)) },
  ])
