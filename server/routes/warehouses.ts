// Warehouses and bins: everyone signed in reads them (labels, pick walks); admins set them up.
import {
  binPatchSchema, binRangeSchema, binSchema, warehousePatchSchema, warehouseSchema,
} from '../../shared/schemas/warehouses.js'
import { ADMIN_ONLY, ANYONE_SIGNED_IN } from '../../shared/roles.js'
import { actorOf, type AppContext } from '../context.js'
import { defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody } from '../http/validate.js'
import {
  createBin, createBinRange, createWarehouse, deleteBin, listWarehouses, updateBin, updateWarehouse, warehouseDetail,
} from '../services/warehouseService.js'

const readers = { roles: ANYONE_SIGNED_IN }
const admin = { roles: ADMIN_ONLY }
const warehouseId = (id: string | string[] | undefined) => idParam(id, 'warehouse_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/warehouses', [
    { method: 'get', path: '/', access: readers, handler: () => listWarehouses(ctx.ds) },
    { method: 'get', path: '/:id', access: readers, handler: (req) => warehouseDetail(ctx.ds, warehouseId(req.params.id)) },
    { method: 'post', path: '/', access: admin, status: 201, handler: (req) => createWarehouse(ctx.ds, actorOf(req), parseBody(warehouseSchema, req.body)) },
    {
      method: 'patch',
      path: '/:id',
      access: admin,
      handler: (req) => updateWarehouse(ctx.ds, actorOf(req), warehouseId(req.params.id), parseBody(warehousePatchSchema, req.body)),
    },
    {
      method: 'post',
      path: '/:id/bins',
      access: admin,
      status: 201,
      handler: (req) => createBin(ctx.ds, actorOf(req), warehouseId(req.params.id), parseBody(binSchema, req.body)),
    },
    {
      method: 'post',
      path: '/:id/bins/range',
      access: admin,
      status: 201,
      handler: (req) => createBinRange(ctx.ds, actorOf(req), warehouseId(req.params.id), parseBody(binRangeSchema, req.body)),
    },
    {
      method: 'patch',
      path: '/:id/bins/:binId',
      access: admin,
      handler: (req) =>
        updateBin(ctx.ds, actorOf(req), warehouseId(req.params.id), idParam(req.params.binId, 'bin_not_found'), parseBody(binPatchSchema, req.body)),
    },
    {
      method: 'delete',
      path: '/:id/bins/:binId',
      access: admin,
      handler: (req) => deleteBin(ctx.ds, actorOf(req), warehouseId(req.params.id), idParam(req.params.binId, 'bin_not_found')),
    },
  ])
