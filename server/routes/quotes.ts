// Quotes at the counter: the counter writes, offers (e-mail), revises and loses them; viewers read.
import { quoteCreateSchema, quoteLoseSchema, quoteQuerySchema, quoteSendSchema, quoteUpdateSchema } from '../../shared/schemas/quotes.js'
import { actorOf, type AppContext } from '../context.js'
import { sendDownload } from '../http/fileResponse.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { idParam, parseBody, parseQuery } from '../http/validate.js'
import { offerQuote, quotePdfFile } from '../services/quotes/quoteMail.js'
import { listQuotes, quoteDetail } from '../services/quotes/quoteRead.js'
import { PDF_TYPE } from '../services/quotes/quotePdf.js'
import { createQuote, loseQuote, reviseQuote, updateQuote } from '../services/quotes/quoteWrite.js'

const readers = allow('admin', 'counter', 'viewer')
const counter = allow('admin', 'counter')
const id = (raw: string | string[] | undefined) => idParam(raw, 'quote_not_found')

export default (ctx: AppContext) =>
  defineRoutes('/quotes', [
    { method: 'get', path: '/', access: readers, handler: (req) => listQuotes(ctx.ds, parseQuery(quoteQuerySchema, req.query)) },
    { method: 'post', path: '/', access: counter, status: 201, handler: (req) => createQuote(ctx.ds, actorOf(req), parseBody(quoteCreateSchema, req.body)) },
    { method: 'get', path: '/:id', access: readers, handler: (req) => quoteDetail(ctx.ds, id(req.params.id)) },
    { method: 'put', path: '/:id', access: counter, handler: (req) => updateQuote(ctx.ds, actorOf(req), id(req.params.id), parseBody(quoteUpdateSchema, req.body)) },
    { method: 'post', path: '/:id/revisions', access: counter, status: 201, handler: (req) => reviseQuote(ctx.ds, actorOf(req), id(req.params.id)) },
    { method: 'post', path: '/:id/offer', access: counter, handler: (req) => offerQuote(ctx.ds, ctx.config, actorOf(req), id(req.params.id), parseBody(quoteSendSchema, req.body)) },
    { method: 'post', path: '/:id/lose', access: counter, handler: (req) => loseQuote(ctx.ds, actorOf(req), id(req.params.id), parseBody(quoteLoseSchema, req.body).reason) },
    {
      method: 'get',
      path: '/:id/pdf',
      access: readers,
      handler: async (req, res) => {
        const file = await quotePdfFile(ctx.ds, id(req.params.id))
        return sendDownload(res, { ...file, type: PDF_TYPE })
      },
    },
  ])
