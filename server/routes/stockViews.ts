// Reading stock: everyone signed in reads stock levels and the ledger (viewer too; counter for
// availability). Setting a manual minimum is for the people who keep stock: admin, warehouse, buyer.
import { ANYONE_SIGNED_IN } from '../../shared/roles.js'
import {
  binContentsQuerySchema, itemOptionsQuerySchema, ledgerExportQuerySchema, ledgerQuerySchema, levelsQuerySchema,
  lookupQuerySchema, lotLevelsQuerySchema, minimumSchema, minimumsQuerySchema, transfersQuerySchema,
} from '../../shared/schemas/stockViews.js'
import { actorOf, type AppContext } from '../context.js'
import { costsOf } from '../http/costAccess.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'
import { prepareLedgerExport } from '../services/stockLedgerExport.js'
import { ledgerPage } from '../services/stockLedgerQuery.js'
import { listMinimums, setMinimum } from '../services/stockMinimums.js'
import { itemOptions, listPlaces, lookupScan } from '../services/stockPickers.js'
import { binContents, listTransfers, lotLevels, stockLevels } from '../services/stockQueries.js'

const readers = { roles: ANYONE_SIGNED_IN }
const keepers = allow('admin', 'warehouse', 'buyer')

export default (ctx: AppContext) =>
  defineRoutes('/stock', [
    { method: 'get', path: '/levels', access: readers, handler: (req) => stockLevels(ctx.ds, parseQuery(levelsQuerySchema, req.query)) },
    { method: 'get', path: '/bin-contents', access: readers, handler: (req) => binContents(ctx.ds, parseQuery(binContentsQuerySchema, req.query)) },
    {
      method: 'get',
      path: '/lot-levels',
      access: readers,
      handler: (req) => lotLevels(ctx.ds, parseQuery(lotLevelsQuerySchema, req.query).itemId),
    },
    { method: 'get', path: '/ledger', access: readers, handler: (req) => ledgerPage(ctx.readDs, parseQuery(ledgerQuerySchema, req.query)) }, // a report: the replica when there is one
    {
      method: 'get',
      path: '/ledger/export',
      access: readers,
      handler: async (req, res) => {
        const plan = await prepareLedgerExport(ctx.ds, parseQuery(ledgerExportQuerySchema, req.query), costsOf(res))
        res.status(200)
        res.set('Content-Type', XLSX_TYPE)
        res.set('Content-Disposition', `attachment; filename="${plan.filename}"`)
        await plan.write(res)
        return undefined
      },
    },
    { method: 'get', path: '/transfers', access: readers, handler: (req) => listTransfers(ctx.ds, parseQuery(transfersQuerySchema, req.query)) },
    { method: 'get', path: '/minimums', access: readers, handler: (req) => listMinimums(ctx.ds, parseQuery(minimumsQuerySchema, req.query)) },
    {
      method: 'put',
      path: '/minimums/:itemId/:warehouseId',
      access: keepers,
      handler: (req) => {
        const key = { itemId: idParam(req.params.itemId, 'item_not_found'), warehouseId: idParam(req.params.warehouseId, 'warehouse_not_found') }
        return setMinimum(ctx.ds, actorOf(req), key, parseBody(minimumSchema, req.body))
      },
    },
    { method: 'get', path: '/places', access: readers, handler: () => listPlaces(ctx.ds) },
    { method: 'get', path: '/item-options', access: readers, handler: (req) => itemOptions(ctx.ds, parseQuery(itemOptionsQuerySchema, req.query)) },
    { method: 'get', path: '/lookup', access: readers, smallAnswer: true, handler: (req) => lookupScan(ctx.ds, parseQuery(lookupQuerySchema, req.query)) },
  ])
