// Purchase orders: list and read (warehouse too, without costs unless allowed), create from accepted
// suggestions, a job's special orders or by hand, edit drafts, approve, mark sent, cancel, close, export.
import type { Request } from 'express'
import {
  poApproveSchema, poExportQuerySchema, poFromJobSchema, poFromSuggestionsSchema, poLineInputSchema, poListQuerySchema, poManualSchema, poReasonSchema,
  poUpdateSchema, suggestionUpdateSchema,
} from '../../shared/schemas/purchasing.js'
import type { AppContext } from '../context.js'
import { actorOf } from '../context.js'
import { costsOf } from '../http/costAccess.js'
import { sendDownload } from '../http/fileResponse.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { specialOrderJobs } from '../services/purchasing/jobPurchasing.js'
import {
  changeOrder, changeSuggestion, createOrder, createOrdersFromJob, createOrdersFromSuggestions, dismissAcceptedSuggestion,
} from '../services/purchasing/poCommands.js'
import { addLine, approve, cancel, close, markSent, removeLine, updateDraft } from '../services/purchasing/poLifecycle.js'
import { listPurchaseOrders, poDetail } from '../services/purchasing/poRead.js'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'
import { multiPoWorkbook, poWorkbook } from '../services/purchasing/poSpreadsheet.js'
import { poPaper } from '../services/purchasing/poDocument.js'
import { PDF_TYPE, poPdf } from '../services/purchasing/poPdf.js'
import { acceptedSuggestions } from '../services/purchasing/suggestionsRead.js'

const buyers = allow('admin', 'buyer')
const readers = allow('admin', 'buyer', 'warehouse')
const poId = (req: Request) => idParam(req.params.id, 'po_not_found')
const suggestionId = (req: Request) => idParam(req.params.suggestionId, 'suggestion_not_found')

export default (ctx: AppContext) => {
  /** A status change or edit of the order in the path, answering the order as it is now. */
  const change = (req: Request, work: Parameters<typeof changeOrder>[2]) => changeOrder(ctx.ds, poId(req), work)
  return defineRoutes('/purchase-orders', [
    {
      method: 'get', path: '/', access: readers,
      handler: (req) => listPurchaseOrders(ctx.ds, parseQuery(poListQuerySchema, req.query)),
    },
    { method: 'get', path: '/suggestions', access: buyers, handler: () => acceptedSuggestions(ctx.ds) },
    {
      method: 'patch', path: '/suggestions/:suggestionId', access: buyers,
      handler: (req) => {
        const input = parseBody(suggestionUpdateSchema, req.body)
        return changeSuggestion(ctx.ds, actorOf(req), suggestionId(req), input)
      },
    },
    {
      method: 'post', path: '/suggestions/:suggestionId/dismiss', access: buyers,
      handler: (req) => dismissAcceptedSuggestion(ctx.ds, actorOf(req), suggestionId(req)),
    },
    { method: 'get', path: '/special-orders', access: buyers, handler: () => specialOrderJobs(ctx.ds) },
    {
      method: 'get', path: '/export', access: buyers,
      handler: async (req, res) => {
        const { ids } = parseQuery(poExportQuerySchema, req.query)
        const papers = await Promise.all(ids.map((id) => poPaper(ctx.ds, id, costsOf(res))))
        return sendDownload(res, { name: `purchase-orders-${new Date().toISOString().slice(0, 10)}.xlsx`, type: XLSX_TYPE, bytes: await multiPoWorkbook(papers) })
      },
    },
    {
      method: 'post', path: '/', access: buyers, status: 201,
      handler: (req) => createOrder(ctx.ds, actorOf(req), parseBody(poManualSchema, req.body)),
    },
    {
      method: 'post', path: '/from-suggestions', access: buyers, status: 201,
      handler: (req) => createOrdersFromSuggestions(ctx.ds, actorOf(req), parseBody(poFromSuggestionsSchema, req.body)),
    },
    {
      method: 'post', path: '/from-job', access: buyers, status: 201,
      handler: (req) => createOrdersFromJob(ctx.ds, actorOf(req), parseBody(poFromJobSchema, req.body)),
    },
    { method: 'get', path: '/:id', access: readers, handler: (req) => poDetail(ctx.ds, poId(req)) },
    {
      method: 'get', path: '/:id/export', access: buyers,
      handler: async (req, res) => {
        const paper = await poPaper(ctx.ds, poId(req), costsOf(res))
        return sendDownload(res, { name: `${paper.po.number}.xlsx`, type: XLSX_TYPE, bytes: await poWorkbook(paper) })
      },
    },
    {
      method: 'get', path: '/:id/pdf', access: buyers,
      handler: async (req, res) => {
        const paper = await poPaper(ctx.ds, poId(req), costsOf(res))
        return sendDownload(res, { name: `${paper.po.number}.pdf`, type: PDF_TYPE, bytes: await poPdf(paper) })
      },
    },
    {
      method: 'patch', path: '/:id', access: buyers,
      handler: (req) => {
        const input = parseBody(poUpdateSchema, req.body)
        return change(req, (em, id) => updateDraft(em, actorOf(req), id, input))
      },
    },
    {
      method: 'post', path: '/:id/lines', access: buyers,
      handler: (req) => {
        const input = parseBody(poLineInputSchema, req.body)
        return change(req, (em, id) => addLine(em, actorOf(req), id, input))
      },
    },
    {
      method: 'delete', path: '/:id/lines/:lineId', access: buyers,
      handler: (req) => change(req, (em, id) => removeLine(em, actorOf(req), id, idParam(req.params.lineId, 'po_line_not_found'))),
    },
    {
      method: 'post', path: '/:id/approve', access: buyers,
      handler: (req) => {
        const { version } = parseBody(poApproveSchema, req.body ?? {})
        return change(req, (em, id) => approve(em, actorOf(req), id, version))
      },
    },
    { method: 'post', path: '/:id/mark-sent', access: buyers, handler: (req) => change(req, (em, id) => markSent(em, actorOf(req), id, 'by hand')) },
    {
      method: 'post', path: '/:id/cancel', access: buyers,
      handler: (req) => {
        const { reason } = parseBody(poReasonSchema, req.body)
        return change(req, (em, id) => cancel(em, actorOf(req), id, reason))
      },
    },
    {
      method: 'post', path: '/:id/close', access: buyers,
      handler: (req) => {
        const { reason } = parseBody(poReasonSchema, req.body)
        return change(req, (em, id) => close(em, actorOf(req), id, reason))
      },
    },
  ])
}
