// The catalog: everyone signed in reads it; only admins change it or import into it.
import { itemListQuerySchema, itemPatchSchema, itemSchema, lotUpdateSchema } from '../../shared/schemas/catalog.js'
import { ADMIN_ONLY, ANYONE_SIGNED_IN } from '../../shared/roles.js'
import { actorOf, type AppContext } from '../context.js'
import { costsOf } from '../http/costAccess.js'
import { sendXlsx } from '../http/fileResponse.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { exportItems, itemImportTemplate } from '../services/catalogExport.js'
import { itemDetail, listItems, listLots, updateLot } from '../services/catalogQueries.js'
import { createItem, deactivateItem, updateItem } from '../services/catalogService.js'
import { receiveUpload } from '../http/upload.js'
import { commitItemImport, previewItemImport } from '../services/itemImport.js'

const readers = { roles: ANYONE_SIGNED_IN }
const admin = { roles: ADMIN_ONLY }
const itemId = (id: string | string[] | undefined) => idParam(id, 'item_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/items', [
    {
      method: 'get',
      path: '/',
      access: readers,
      handler: (req) => listItems(ctx.ds, parseQuery(itemListQuerySchema, req.query)),
    },
    {
      method: 'get',
      path: '/export.xlsx',
      access: readers,
      handler: async (req, res) => {
        const query = parseQuery(itemListQuerySchema, req.query)
        sendXlsx(res, `lumenyard-items-${new Date().toISOString().slice(0, 10)}.xlsx`, await exportItems(ctx.ds, query, costsOf(res)))
      },
    },
    {
      method: 'get',
      path: '/import/template.xlsx',
      access: admin,
      handler: async (req, res) => sendXlsx(res, 'lumenyard-item-import-template.xlsx', await itemImportTemplate(req.user!.locale, costsOf(res))),
    },
    {
      method: 'post',
      path: '/import/preview',
      access: admin,
      handler: async (req, res) => previewItemImport(ctx.ds, await receiveUpload(req, res, { maxBytes: ctx.config.uploadMaxBytes })),
    },
    {
      method: 'post',
      path: '/import/commit',
      access: admin,
      handler: async (req, res) => commitItemImport(ctx.ds, actorOf(req), await receiveUpload(req, res, { maxBytes: ctx.config.uploadMaxBytes })),
    },
    { method: 'get', path: '/:id', access: readers, handler: (req) => itemDetail(ctx.ds, itemId(req.params.id)) },
    { method: 'post', path: '/', access: admin, status: 201, handler: (req) => createItem(ctx.ds, actorOf(req), parseBody(itemSchema, req.body)) },
    {
      method: 'patch',
      path: '/:id',
      access: admin,
      handler: (req) => updateItem(ctx.ds, actorOf(req), itemId(req.params.id), parseBody(itemPatchSchema, req.body)),
    },
    { method: 'post', path: '/:id/deactivate', access: admin, handler: (req) => deactivateItem(ctx.ds, actorOf(req), itemId(req.params.id)) },
    { method: 'get', path: '/:id/lots', access: readers, handler: (req) => listLots(ctx.ds, itemId(req.params.id)) },
    {
      method: 'patch',
      path: '/:id/lots/:lotId',
      access: allow('admin', 'warehouse'),
      handler: (req) =>
        updateLot(ctx.ds, actorOf(req), itemId(req.params.id), idParam(req.params.lotId, 'lot_not_found'), parseBody(lotUpdateSchema, req.body)),
    },
  ])
