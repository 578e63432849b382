// Reports for the owner and the buyer (admin and buyer): what the stock was worth, read from the ledger.
// Values go out under the cost rule's names (services/costVisibility.ts), which leaves them out for
// anyone who may not see costs.
import { z } from 'zod'
import { deadStockQuerySchema, periodQuerySchema, reportLang, stockValuationQuerySchema } from '../../shared/schemas/reports.js'
import type { AppContext } from '../context.js'
import { costsOf } from '../http/costAccess.js'
import { readSource } from '../http/readSource.js'
import { allow, defineRoutes } from '../http/routeTable.js'
import { parseQuery } from '../http/validate.js'
import type { Request, Response } from 'express'
import { XLSX_TYPE } from '../services/exports/xlsxWriter.js'
import { deadAndSlowStock } from '../services/reports/deadStock.js'
import { deadStockExport, turnsExport, usageExport, vendorsExport, type ExportReader, type ReportExport } from '../services/reports/reportExports.js'
import { stockTurns } from '../services/reports/stockTurns.js'
import { stockValuation } from '../services/reports/stockValuation.js'
import { usageByMonth } from '../services/reports/usageByMonth.js'
import { vendorPerformance } from '../services/reports/vendorPerformance.js'

const owners = allow('admin', 'buyer')
const langOf = (req: Request) => z.object({ lang: reportLang }).parse({ lang: req.query.lang }).lang
const readerOf = (req: Request, res: Response): ExportReader => ({ lang: langOf(req), costs: costsOf(res) })

/** A report's spreadsheet, streamed as it is written. */
async function send(res: Response, plan: ReportExport): Promise<undefined> {
  res.status(200)
  res.set('Content-Type', XLSX_TYPE)
  res.set('Content-Disposition', `attachment; filename="${plan.filename}"`)
  await plan.write(res)
  return undefined
}

export default (ctx: AppContext) =>
  defineRoutes('/reports', [
    {
      method: 'get', path: '/stock-valuation', access: owners,
      handler: (req) => stockValuation(readSource(ctx), parseQuery(stockValuationQuerySchema, req.query)),
    },
    { method: 'get', path: '/turns', access: owners, handler: (req) => stockTurns(readSource(ctx), parseQuery(periodQuerySchema, req.query)) },
    { method: 'get', path: '/dead-stock', access: owners, handler: (req) => deadAndSlowStock(readSource(ctx), parseQuery(deadStockQuerySchema, req.query)) },
    { method: 'get', path: '/usage', access: owners, handler: (req) => usageByMonth(readSource(ctx), parseQuery(periodQuerySchema, req.query)) },
    { method: 'get', path: '/vendors', access: owners, handler: (req) => vendorPerformance(readSource(ctx), parseQuery(periodQuerySchema, req.query)) },
    { method: 'get', path: '/turns/export', access: owners, handler: async (req, res) => send(res, await turnsExport(readSource(ctx), { ...parseQuery(periodQuerySchema, req.query), ...readerOf(req, res) })) },
    { method: 'get', path: '/usage/export', access: owners, handler: async (req, res) => send(res, await usageExport(readSource(ctx), { ...parseQuery(periodQuerySchema, req.query), ...readerOf(req, res) })) },
    { method: 'get', path: '/dead-stock/export', access: owners, handler: async (req, res) => send(res, await deadStockExport(readSource(ctx), { ...parseQuery(deadStockQuerySchema, req.query), ...readerOf(req, res) })) },
    { method: 'get', path: '/vendors/export', access: owners, handler: async (req, res) => send(res, await vendorsExport(readSource(ctx), { ...parseQuery(periodQuerySchema, req.query), ...readerOf(req, res) })) },
  ])
