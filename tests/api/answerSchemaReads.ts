// Every JSON read the server routes, with the schema the client checks its answer with (src/api/*.ts) and a
// real address for it in the demo scenario: ids are taken from the lists, never assumed. Used by
// answerSchemas.test.ts, which reads each address as every role the role matrix lets read it; a new GET route
// fails there until it has a row here or is a file download.
import { randomUUID } from 'node:crypto'
import { z } from 'zod'
import type { Role } from '../../shared/roles.js'
import { sessionAnswerSchema, signedInAnswerSchema, userSummarySchema } from '../../shared/schemas/auth.js'
import { auditTrailPageShape } from '../../shared/schemas/answers/audit.js'
import { itemDetailShape, itemPageShape, lotRowsShape } from '../../shared/schemas/answers/catalog.js'
import { bomRecordShape, jobDetailShape, ruleRecordShape, takeoffRecordShape } from '../../shared/schemas/answers/counter.js'
import {
  countAccuracyRowShape, countDetailShape, countDuePlanShape, countHistoryRowShape, countSettingsShape, countSummaryShape, handheldCountShape,
} from '../../shared/schemas/answers/counts.js'
import { currentDataImportRunShape, dataImportRecordShape } from '../../shared/schemas/answers/dataImports.js'
import { currentExportJobShape } from '../../shared/schemas/answers/businessExport.js'
import { deviceOutboxSummaryShape } from '../../shared/schemas/answers/devices.js'
import { orderFulfilmentShape, ticketDetailShape, ticketSummaryShape } from '../../shared/schemas/answers/handover.js'
import { bomForPickingShape, pickListDetailShape, pickListSummaryShape, walkWarehouseShape } from '../../shared/schemas/answers/picking.js'
import { customerTermsSummaryShape, priceLevelSummaryShape, priceRuleSummaryShape, taxRateSummaryShape } from '../../shared/schemas/answers/pricing.js'
import { companyProfileShape, purchasingSettingsShape } from '../../shared/schemas/answers/purchasing.js'
import {
  itemChoiceShape, jobPurchaseLinesShape, outboxSummaryShape, poDetailShape, poSummaryShape, receiptViewShape, receivingContextShape,
  specialOrderJobShape, suggestionViewShape, vendorItemViewShape, vendorViewShape, warehouseChoiceShape,
} from '../../shared/schemas/answers/purchasingViews.js'
import { quoteDetailShape, quoteSummaryShape } from '../../shared/schemas/answers/quotes.js'
import { abcParetoShape, reorderChoicesShape, reorderLineDetailShape, reorderPolicyViewShape, suggestionListShape } from '../../shared/schemas/answers/reorder.js'
import { deadStockReportShape, turnsReportShape, usageReportShape, valuationReportShape, vendorReportShape } from '../../shared/schemas/answers/reports.js'
import { paymentViewShape, salesOrderDetailShape, salesOrderSummaryShape, salesSettingsShape } from '../../shared/schemas/answers/salesOrders.js'
import { salesReturnViewShape } from '../../shared/schemas/answers/salesReturns.js'
import {
  binContentsAnswerShape, itemOptionShape, ledgerPageShape, lookupAnswerShape, lotLevelsAnswerShape, minimumRowShape, stockLevelsAnswerShape,
  transferViewShape,
} from '../../shared/schemas/answers/stockViews.js'
import { todayAnswerShape } from '../../shared/schemas/answers/today.js'
import { counterCatalogSchema, customerSummarySchema, jobSummarySchema, roleItemRecordSchema } from '../../shared/schemas/counter.js'
import { setupStateSchema } from '../../shared/schemas/setup.js'
import { placesSchema } from '../../shared/schemas/stockViews.js'
import { warehouseDetailSchema, warehouseRowSchema } from '../../shared/schemas/warehouses.js'
import { siteFiguresSchema, materialFamilySchema } from '../../shared/schemas/takeoff.js'
import { CSRF, type ApiHarness } from '../support/apiHarness.js'

export interface Read {
  /** The route as the role matrix names it: its row there says which roles read it. */
  route: string
  path: string
  schema: z.ZodType
  /** The answer (or this list in it) must hold rows, so the check is not made on an empty list. */
  nonEmpty?: true | string
}

/** Reads whose answer another API test parses with the same schema, on a record only it can make (a card payment
 * needs the payment provider's fake), by route and the test that does it. */
export const CHECKED_ELSEWHERE: Record<string, string> = {
  'GET /api/sales-orders/:id/card-deposits/:paymentId': 'tests/api/cardDepositFollow.test.ts (cardDepositStateShape.parse)',
  'GET /api/imports/runs/:id/problems': 'tests/api/importProblems.test.ts (dataImportProblemPageShape.parse)',
}

/** Answers that are files (spreadsheets, PDFs, images), not JSON; and the health probe, read by machines. */
export const FILE_ROUTES = new Set([
  'GET /api/health', 'GET /api/items/export.xlsx', 'GET /api/items/import/template.xlsx', 'GET /api/imports/:kind/template.xlsx',
  'GET /api/business-export', 'GET /api/business-export/jobs/:id/file', 'GET /api/setup/printed-logo', 'GET /api/setup/logo', 'GET /api/stock/ledger/export', 'GET /api/quotes/:id/pdf',
  'GET /api/handover-tickets/:id/pdf', 'GET /api/handover-tickets/:id/signature', 'GET /api/takeoffs/import-template', 'GET /api/boms/:id/export',
  'GET /api/vendors/price-list/template', 'GET /api/purchase-orders/export', 'GET /api/purchase-orders/:id/export',
  'GET /api/purchase-orders/:id/pdf', 'GET /api/purchasing/outbox/:id/attachments/:attachmentId', 'GET /api/audit/export',
  'GET /api/reports/turns/export', 'GET /api/reports/usage/export', 'GET /api/reports/dead-stock/export', 'GET /api/reports/vendors/export',
])

const TZ = 'America/Chicago'

async function firstId(h: ApiHarness, role: Role, path: string, pick: (rows: { id: number }[]) => { id: number } | undefined = (r) => r[0]): Promise<number> {
  const got = await (await h.as(role)).get(path)
  const rows = (Array.isArray(got.body) ? got.body : got.body.rows ?? got.body.lines ?? []) as { id: number }[]
  const row = pick(rows)
  if (!row) throw new Error(`${path} answered ${got.status} with no row to read further: ${JSON.stringify(got.body).slice(0, 200)}`)
  return row.id
}

/**
 * The demo scenario holds no pick list, handover ticket or cycle count: one of each is made the way the screens
 * make them (an order sent to the warehouse, its first line picked, the pick completed and handed over on a ticket, a count
 * of one bin).
 */
async function madeRecords(h: ApiHarness, warehouseId: number): Promise<{ pickList: number; ticket: number; count: number }> {
  const counter = await h.as('counter')
  const crew = await h.as('warehouse')
  const keyed = { ...CSRF, 'Idempotency-Key': '' }
  const orders = (await counter.get('/api/sales-orders')).body as { id: number; status: string }[]
  let pickList = 0
  let orderId = 0
  for (const o of orders.filter((r) => r.status === 'booked')) {
    const sent = await counter.post(`/api/sales-orders/${o.id}/pick-lists`).set({ ...keyed, 'Idempotency-Key': randomUUID() })
    if (sent.status === 201) {
      pickList = sent.body.pickListId
      orderId = o.id
      break
    }
  }
  if (!pickList) throw new Error('no booked demo order could be sent to the warehouse')
  const line = (await crew.get(`/api/pick-lists/${pickList}`)).body.lines[0] as { id: number; binCode: string; sku: string; qty: number; lotCode: string | null }
  const confirmed = await crew.post(`/api/pick-lists/${pickList}/confirmations`).set({ ...keyed, 'Idempotency-Key': randomUUID() })
    .send({ lineId: line.id, binScan: `B:${line.binCode}`, itemScan: line.sku, lotScan: line.lotCode, qty: line.qty })
  if (confirmed.status !== 201) throw new Error(`the pick was not confirmed: ${JSON.stringify(confirmed.body)}`)
  const completed = await crew.post(`/api/pick-lists/${pickList}/complete`).set({ ...keyed, 'Idempotency-Key': randomUUID() }).send({ acceptShort: true })
  if (completed.status !== 200) throw new Error(`the pick was not completed: ${JSON.stringify(completed.body)}`)
  const waiting = ((await counter.get(`/api/sales-orders/${orderId}/fulfilment`)).body.lines as { id: number; waiting: number }[]).find((l) => l.waiting > 0)!
  const ticket = await counter.post(`/api/sales-orders/${orderId}/tickets`).set({ ...keyed, 'Idempotency-Key': randomUUID() })
    .send({ kind: 'pickup', lines: [{ salesOrderLineId: waiting.id, qty: waiting.waiting }] })
  if (ticket.status !== 201) throw new Error(`no ticket was made: ${JSON.stringify(ticket.body)}`)
  const bin = ((await crew.get(`/api/warehouses/${warehouseId}`)).body.bins as { id: number }[])[0]
  const count = await crew.post('/api/counts').set(CSRF).send({ scope: 'bins', warehouseId, binIds: [bin.id] })
  if (count.status !== 201) throw new Error(`no count was opened: ${JSON.stringify(count.body)}`)
  return { pickList, ticket: ticket.body.id, count: count.body.id }
}

const made = new WeakMap<ApiHarness, Promise<Read[]>>()

/** Every read with a real address, ids taken from the demo scenario's lists (made once per harness). */
export function everyRead(h: ApiHarness): Promise<Read[]> {
  if (!made.has(h)) made.set(h, readsOf(h))
  return made.get(h)!
}

async function readsOf(h: ApiHarness): Promise<Read[]> {
  const admin = await h.as('admin')
  const warehouses = (await admin.get('/api/warehouses')).body as { id: number; code: string }[]
  const hry = warehouses.find((w) => w.code === 'HRY')!.id
  const items = (await admin.get('/api/items?pageSize=50&q=')).body.rows as { id: number; sku: string; matchLot: boolean; onHand: number }[]
  const stocked = items.find((i) => i.onHand > 0)!
  const lotted = items.find((i) => i.matchLot && i.onHand > 0) ?? stocked
  const job = await firstId(h, 'counter', '/api/jobs?limit=200')
  const jobDetail = (await admin.get(`/api/jobs/${job}`)).body as { takeoffList: { id: number }[]; boms: { id: number }[] }
  let takeoff = jobDetail.takeoffList[0]?.id
  let bom = jobDetail.boms[0]?.id
  for (const j of (await admin.get('/api/jobs?limit=200')).body as { id: number }[]) {
    if (takeoff && bom) break
    const d = (await admin.get(`/api/jobs/${j.id}`)).body as typeof jobDetail
    takeoff ??= d.takeoffList[0]?.id
    bom ??= d.boms[0]?.id
  }
  const quote = await firstId(h, 'counter', '/api/quotes?status=all')
  const order = await firstId(h, 'counter', '/api/sales-orders?status=all')
  const customer = await firstId(h, 'counter', '/api/customers?active=all')
  const vendor = await firstId(h, 'buyer', '/api/vendors')
  const po = await firstId(h, 'buyer', '/api/purchase-orders')
  const { pickList, ticket, count } = await madeRecords(h, hry)
  const line = ((await (await h.as('buyer')).get(`/api/reorder/suggestions?tz=${TZ}`)).body.lines as { itemId: number; warehouseId: number }[])[0]
  const period = `from=2026-01-01&to=2026-03-31&tz=${TZ}`

  const reads: Read[] = [
    { route: 'GET /api/session', path: '/api/session', schema: sessionAnswerSchema },
    { route: 'GET /api/warehouses', path: '/api/warehouses', schema: z.array(warehouseRowSchema), nonEmpty: true },
    { route: 'GET /api/warehouses/:id', path: `/api/warehouses/${hry}`, schema: warehouseDetailSchema, nonEmpty: 'bins' },
    { route: 'GET /api/stock/places', path: '/api/stock/places', schema: placesSchema, nonEmpty: true },
    { route: 'GET /api/takeoffs/catalog', path: '/api/takeoffs/catalog', schema: counterCatalogSchema, nonEmpty: 'blocks' },
    { route: 'GET /api/setup', path: '/api/setup', schema: setupStateSchema },
    { route: 'GET /api/users', path: '/api/users', schema: z.array(userSummarySchema), nonEmpty: true },
    { route: 'GET /api/items', path: '/api/items?pageSize=50', schema: itemPageShape, nonEmpty: 'rows' },
    { route: 'GET /api/items/:id/lots', path: `/api/items/${lotted.id}/lots`, schema: lotRowsShape, nonEmpty: true },
    { route: 'GET /api/customers', path: '/api/customers?active=all', schema: z.array(customerSummarySchema), nonEmpty: true },
    { route: 'GET /api/jobs', path: '/api/jobs?limit=200', schema: z.array(jobSummarySchema), nonEmpty: true },
    { route: 'GET /api/profile', path: '/api/profile', schema: signedInAnswerSchema },
    { route: 'GET /api/items/:id', path: `/api/items/${stocked.id}`, schema: itemDetailShape },
    { route: 'GET /api/imports', path: '/api/imports', schema: z.array(dataImportRecordShape) },
    { route: 'GET /api/imports/runs/current', path: '/api/imports/runs/current', schema: currentDataImportRunShape },
    { route: 'GET /api/business-export/jobs/current', path: '/api/business-export/jobs/current', schema: currentExportJobShape },
    { route: 'GET /api/stock/levels', path: `/api/stock/levels?warehouseId=${hry}`, schema: stockLevelsAnswerShape, nonEmpty: 'rows' },
    { route: 'GET /api/stock/bin-contents', path: `/api/stock/bin-contents?warehouseId=${hry}`, schema: binContentsAnswerShape },
    { route: 'GET /api/stock/lot-levels', path: `/api/stock/lot-levels?itemId=${stocked.id}`, schema: lotLevelsAnswerShape },
    { route: 'GET /api/stock/ledger', path: '/api/stock/ledger?pageSize=50', schema: ledgerPageShape, nonEmpty: 'rows' },
    { route: 'GET /api/stock/transfers', path: '/api/stock/transfers', schema: z.array(transferViewShape) },
    { route: 'GET /api/stock/minimums', path: `/api/stock/minimums?warehouseId=${hry}`, schema: z.array(minimumRowShape) },
    { route: 'GET /api/stock/item-options', path: '/api/stock/item-options?q=', schema: z.array(itemOptionShape), nonEmpty: true },
    { route: 'GET /api/stock/lookup', path: `/api/stock/lookup?kind=sku&code=${encodeURIComponent(stocked.sku)}&warehouseId=${hry}`, schema: lookupAnswerShape },
    { route: 'GET /api/pricing/levels', path: '/api/pricing/levels', schema: z.array(priceLevelSummaryShape) },
    { route: 'GET /api/pricing/rules', path: '/api/pricing/rules', schema: z.array(priceRuleSummaryShape) },
    { route: 'GET /api/pricing/tax-rates', path: '/api/pricing/tax-rates', schema: z.array(taxRateSummaryShape) },
    { route: 'GET /api/pricing/accounts', path: '/api/pricing/accounts', schema: z.array(customerTermsSummaryShape) },
    { route: 'GET /api/pricing/accounts/:customerId', path: `/api/pricing/accounts/${customer}`, schema: customerTermsSummaryShape },
    { route: 'GET /api/quotes', path: '/api/quotes?status=all', schema: z.array(quoteSummaryShape), nonEmpty: true },
    { route: 'GET /api/quotes/:id', path: `/api/quotes/${quote}`, schema: quoteDetailShape },
    { route: 'GET /api/sales-orders', path: '/api/sales-orders?status=all', schema: z.array(salesOrderSummaryShape), nonEmpty: true },
    { route: 'GET /api/sales-orders/:id', path: `/api/sales-orders/${order}`, schema: salesOrderDetailShape },
    { route: 'GET /api/sales-orders/:id/payments', path: `/api/sales-orders/${order}/payments`, schema: z.array(paymentViewShape) },
    { route: 'GET /api/sales-orders/:id/fulfilment', path: `/api/sales-orders/${order}/fulfilment`, schema: orderFulfilmentShape },
    { route: 'GET /api/sales-orders/:id/returns', path: `/api/sales-orders/${order}/returns`, schema: z.array(salesReturnViewShape) },
    { route: 'GET /api/handover-tickets', path: '/api/handover-tickets?status=all', schema: z.array(ticketSummaryShape), nonEmpty: true },
    { route: 'GET /api/handover-tickets/:id', path: `/api/handover-tickets/${ticket}`, schema: ticketDetailShape },
    { route: 'GET /api/sales-settings', path: '/api/sales-settings', schema: salesSettingsShape },
    { route: 'GET /api/customers/:id', path: `/api/customers/${customer}`, schema: customerSummarySchema },
    { route: 'GET /api/takeoffs/:id', path: `/api/takeoffs/${takeoff}`, schema: takeoffRecordShape },
    { route: 'GET /api/boms/:id', path: `/api/boms/${bom}`, schema: bomRecordShape },
    { route: 'GET /api/jobs/:id', path: `/api/jobs/${job}`, schema: jobDetailShape },
    { route: 'GET /api/takeoff-settings/rules', path: '/api/takeoff-settings/rules', schema: z.array(ruleRecordShape), nonEmpty: true },
    { route: 'GET /api/takeoff-settings/waste', path: '/api/takeoff-settings/waste', schema: z.record(materialFamilySchema, z.number()) },
    { route: 'GET /api/takeoff-settings/figures', path: '/api/takeoff-settings/figures', schema: siteFiguresSchema },
    { route: 'GET /api/takeoff-settings/role-items', path: '/api/takeoff-settings/role-items', schema: z.array(roleItemRecordSchema), nonEmpty: true },
    { route: 'GET /api/reorder/suggestions', path: `/api/reorder/suggestions?tz=${TZ}`, schema: suggestionListShape, nonEmpty: 'lines' },
    { route: 'GET /api/reorder/choices', path: '/api/reorder/choices', schema: reorderChoicesShape },
    { route: 'GET /api/reorder/lines/:itemId/:warehouseId', path: `/api/reorder/lines/${line.itemId}/${line.warehouseId}`, schema: reorderLineDetailShape },
    { route: 'GET /api/reorder/abc', path: '/api/reorder/abc', schema: abcParetoShape },
    { route: 'GET /api/reorder/policies', path: '/api/reorder/policies', schema: z.array(reorderPolicyViewShape) },
    { route: 'GET /api/pick-lists', path: '/api/pick-lists?status=all', schema: z.array(pickListSummaryShape), nonEmpty: true },
    { route: 'GET /api/pick-lists/boms', path: '/api/pick-lists/boms', schema: z.array(bomForPickingShape) },
    { route: 'GET /api/pick-lists/:id', path: `/api/pick-lists/${pickList}`, schema: pickListDetailShape },
    { route: 'GET /api/picking/warehouses', path: '/api/picking/warehouses', schema: z.array(walkWarehouseShape), nonEmpty: true },
    { route: 'GET /api/vendors', path: '/api/vendors', schema: z.array(vendorViewShape), nonEmpty: true },
    { route: 'GET /api/vendors/:id', path: `/api/vendors/${vendor}`, schema: vendorViewShape },
    { route: 'GET /api/vendors/:id/items', path: `/api/vendors/${vendor}/items`, schema: z.array(vendorItemViewShape), nonEmpty: true },
    { route: 'GET /api/purchase-orders', path: '/api/purchase-orders', schema: z.array(poSummaryShape), nonEmpty: true },
    { route: 'GET /api/purchase-orders/suggestions', path: '/api/purchase-orders/suggestions', schema: z.array(suggestionViewShape) },
    { route: 'GET /api/purchase-orders/special-orders', path: '/api/purchase-orders/special-orders', schema: z.array(specialOrderJobShape) },
    { route: 'GET /api/purchase-orders/:id', path: `/api/purchase-orders/${po}`, schema: poDetailShape },
    { route: 'GET /api/purchase-orders/:id/receiving', path: `/api/purchase-orders/${po}/receiving`, schema: receivingContextShape },
    { route: 'GET /api/purchase-orders/:id/receipts', path: `/api/purchase-orders/${po}/receipts`, schema: z.array(receiptViewShape) },
    { route: 'GET /api/purchasing/items', path: '/api/purchasing/items?q=', schema: z.array(itemChoiceShape) },
    { route: 'GET /api/purchasing/warehouses', path: '/api/purchasing/warehouses', schema: z.array(warehouseChoiceShape), nonEmpty: true },
    { route: 'GET /api/purchasing/settings', path: '/api/purchasing/settings', schema: purchasingSettingsShape },
    { route: 'GET /api/purchasing/company', path: '/api/purchasing/company', schema: companyProfileShape },
    { route: 'GET /api/purchasing/outbox', path: '/api/purchasing/outbox', schema: z.array(outboxSummaryShape) },
    { route: 'GET /api/jobs/:id/purchase-lines', path: `/api/jobs/${job}/purchase-lines`, schema: jobPurchaseLinesShape },
    { route: 'GET /api/devices/outbox', path: `/api/devices/outbox?warehouseId=${hry}`, schema: deviceOutboxSummaryShape },
    { route: 'GET /api/counts', path: '/api/counts?status=all', schema: z.array(countSummaryShape), nonEmpty: true },
    { route: 'GET /api/counts/due', path: `/api/counts/due?warehouseId=${hry}`, schema: countDuePlanShape },
    { route: 'GET /api/counts/settings', path: '/api/counts/settings', schema: countSettingsShape },
    { route: 'GET /api/counts/history', path: `/api/counts/history?itemId=${stocked.id}&warehouseId=${hry}`, schema: z.array(countHistoryRowShape) },
    { route: 'GET /api/counts/accuracy', path: `/api/counts/accuracy?from=2026-01-01&to=2026-12-31&warehouseId=${hry}`, schema: z.array(countAccuracyRowShape) },
    { route: 'GET /api/counts/:id', path: `/api/counts/${count}`, schema: countDetailShape },
    { route: 'GET /api/counts/:id/handheld', path: `/api/counts/${count}/handheld`, schema: handheldCountShape },
    { route: 'GET /api/audit', path: '/api/audit', schema: auditTrailPageShape, nonEmpty: 'entries' },
    { route: 'GET /api/today', path: `/api/today?tz=${TZ}`, schema: todayAnswerShape },
    { route: 'GET /api/reports/stock-valuation', path: `/api/reports/stock-valuation?tz=${TZ}`, schema: valuationReportShape },
    { route: 'GET /api/reports/turns', path: `/api/reports/turns?${period}`, schema: turnsReportShape },
    { route: 'GET /api/reports/usage', path: `/api/reports/usage?${period}`, schema: usageReportShape },
    { route: 'GET /api/reports/vendors', path: `/api/reports/vendors?${period}`, schema: vendorReportShape },
    { route: 'GET /api/reports/dead-stock', path: '/api/reports/dead-stock', schema: deadStockReportShape },
  ]
  return reads
}
