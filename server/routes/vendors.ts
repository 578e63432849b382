// Vendors and their items (vendor SKU, purchase pack, minimum order, cost, lead time, preferred).
import type { Request } from 'express'
import { vendorCreateSchema, vendorItemSchema, vendorItemUpdateSchema, vendorUpdateSchema } from '../../shared/schemas/purchasing.js'
import type { AppContext } from '../context.js'
import { actorOf } from '../context.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody } from '../http/validate.js'
import {
  addVendorItem, createVendor, getVendor, listVendorItems, listVendors, removeVendorItem, updateVendor, updateVendorItem,
} from '../services/purchasing/vendorService.js'
import { commitPriceList, previewPriceList, priceListTemplate } from '../services/purchasing/priceListImport.js'
import { receiveUpload } from '../http/upload.js'
import { sendDownload } from '../http/fileResponse.js'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'

const buyers = allow('admin', 'buyer')
const vendorId = (req: Request) => idParam(req.params.id, 'vendor_not_found')
const itemId = (req: Request) => idParam(req.params.itemId, 'vendor_item_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/vendors', [
    { method: 'get', path: '/', access: buyers, handler: () => listVendors(ctx.ds) },
    { method: 'post', path: '/', access: buyers, status: 201, handler: (req) => createVendor(ctx.ds, actorOf(req), parseBody(vendorCreateSchema, req.body)) },
    { method: 'get', path: '/:id', access: buyers, handler: (req) => getVendor(ctx.ds, vendorId(req)) },
    {
      method: 'patch', path: '/:id', access: buyers,
      handler: (req) => updateVendor(ctx.ds, actorOf(req), vendorId(req), parseBody(vendorUpdateSchema, req.body)),
    },
    { method: 'get', path: '/:id/items', access: buyers, handler: (req) => listVendorItems(ctx.ds, vendorId(req)) },
    {
      method: 'post', path: '/:id/items', access: buyers, status: 201,
      handler: (req) => addVendorItem(ctx.ds, actorOf(req), vendorId(req), parseBody(vendorItemSchema, req.body)),
    },
    {
      method: 'patch', path: '/:id/items/:itemId', access: buyers,
      handler: (req) => updateVendorItem(ctx.ds, actorOf(req), vendorId(req), itemId(req), parseBody(vendorItemUpdateSchema, req.body)),
    },
    {
      method: 'get', path: '/price-list/template', access: buyers,
      handler: async (_req, res) => sendDownload(res, { name: 'lumenyard-price-list-template.xlsx', type: XLSX_TYPE, bytes: await priceListTemplate() }),
    },
    {
      method: 'post', path: '/:id/price-list/preview', access: buyers,
      handler: async (req, res) => {
        const id = vendorId(req)
        return previewPriceList(ctx.ds, id, await receiveUpload(req, res, { maxBytes: ctx.config.uploadMaxBytes }))
      },
    },
    {
      method: 'post', path: '/:id/price-list/commit', access: buyers,
      handler: async (req, res) => {
        const id = vendorId(req)
        return commitPriceList(ctx.ds, actorOf(req), id, await receiveUpload(req, res, { maxBytes: ctx.config.uploadMaxBytes }))
      },
    },
    {
      method: 'delete', path: '/:id/items/:itemId', access: buyers,
      handler: async (req) => {
        await removeVendorItem(ctx.ds, actorOf(req), vendorId(req), itemId(req))
        return { ok: true }
      },
    },
  ])
