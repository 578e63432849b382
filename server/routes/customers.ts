// Contractor accounts at the counter.
import { customerCreateSchema, customerQuerySchema, customerUpdateSchema } from '../../shared/schemas/counter.js'
import { actorOf, type AppContext } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { createCustomer, deleteCustomer, getCustomer, listCustomers, updateCustomer } from '../services/counter/customerService.js'

const counter = allow('admin', 'counter')
const id = (raw: string | string[] | undefined) => idParam(raw, 'customer_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/customers', [
    { method: 'get', path: '/', access: counter, handler: (req) => listCustomers(ctx.ds, parseQuery(customerQuerySchema, req.query)) },
    {
      method: 'post',
      path: '/',
      access: counter,
      status: 201,
      handler: (req) => createCustomer(ctx.ds, actorOf(req), parseBody(customerCreateSchema, req.body)),
    },
    { method: 'get', path: '/:id', access: counter, handler: (req) => getCustomer(ctx.ds, id(req.params.id)) },
    {
      method: 'patch',
      path: '/:id',
      access: counter,
      handler: (req) => updateCustomer(ctx.ds, actorOf(req), id(req.params.id), parseBody(customerUpdateSchema, req.body)),
    },
    { method: 'delete', path: '/:id', access: counter, handler: (req) => deleteCustomer(ctx.ds, actorOf(req), id(req.params.id)) },
  ])
