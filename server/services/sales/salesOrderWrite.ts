// A contractor takes a quote: in one transaction the quote becomes taken and a sales order is made from
// its lines. Stocked lines are held in the quote's warehouse (allocated by bin and lot the way a pick plan
// allocates, held under the order's own doc type, SALES_ORDER_DOC); made-to-order lines raise special-order PO lines of their
// own, which cannot be sent to the vendor until the order's deposit is paid. Taking the same quote again
// answers the order already made. Cancelling releases the holds once.
import { In, type DataSource, type EntityManager } from 'typeorm'
import { depositRequired, lineTaxShares } from '../../../shared/sales/salesOrderMoney.js'
import type { SalesOrderDetail } from '../../../shared/schemas/salesOrders.js'
import { BomLine } from '../../entities/Bom.js'
import { Job } from '../../entities/Customer.js'
import { Item } from '../../entities/Item.js'
import { Quote, QuoteLine } from '../../entities/Quote.js'
import { SalesOrder, SalesOrderLine } from '../../entities/SalesOrder.js'
import { inTransaction } from '../../db/transaction.js'
import { AppError } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { StockPool } from '../picking/pickPlanning.js'
import { orderSpecialLines, type SpecialLine } from '../purchasing/jobPurchasing.js'
import { preferredVendors } from '../purchasing/poWrite.js'
import { ensureQuote, lockQuote } from '../quotes/quoteWrite.js'
import { releaseReservations, reserve, type ReserveLine } from '../stock/stockReservations.js'
import { salesSettings } from './salesSettings.js'
import { releaseFulfilment } from './fulfilment.js'
import { salesOrderDetail } from './salesOrderRead.js'

/** The doc_type of an order's holds (stock_reservations): holds, not stock moves. */
export const SALES_ORDER_DOC = 'sales_order'

type Actor = AuditActor & { userId: number }

export async function lockSalesOrder(em: EntityManager, id: number): Promise<SalesOrder> {
  const order = await em.findOne(SalesOrder, { where: { id }, lock: { mode: 'pessimistic_write' } })
  if (!order) throw AppError.notFound('sales_order_not_found', 'That sales order was not found.')
  return order
}

/** Holds each stocked line's quantity in the warehouse, bin by bin and lot by lot; answers what each line got. */
async function holdStock(em: EntityManager, actor: Actor, order: SalesOrder, lines: SalesOrderLine[]): Promise<void> {
  const stocked = lines.filter((l) => !l.madeToOrder)
  if (!stocked.length) return
  const items = new Map((await em.findBy(Item, { id: In([...new Set(stocked.map((l) => l.itemId))]) })).map((i) => [i.id, i]))
  const pool = new StockPool(em)
  const holds: ReserveLine[] = []
  for (const line of stocked) {
    const result = await pool.take(line.itemId, order.warehouseId, line.qty, items.get(line.itemId)?.matchLot ?? false)
    for (const a of result.lines) {
      holds.push({ itemId: line.itemId, binId: Number(a.binId), lotId: a.lotId === null ? null : Number(a.lotId), qty: a.qty, docLineId: line.id })
    }
    line.qtyReserved = result.allocated
  }
  if (!holds.length) return
  try {
    await reserve(em, actor, { doc: { docType: SALES_ORDER_DOC, docId: order.id }, lines: holds })
  } catch (err) {
    if (err instanceof AppError && err.code === 'insufficient_stock') {
      throw AppError.conflict('stock_taken', `The stock changed while this order was being made: ${err.message} Nothing was held; try again.`)
    }
    throw err
  }
  for (const line of stocked) if (line.qtyReserved) await em.update(SalesOrderLine, { id: line.id }, { qtyReserved: line.qtyReserved })
}

/**
 * Made-to-order lines become special-order PO lines, on a PO of the order's own per vendor (never joined to
 * another draft, so the deposit holds back only this order's goods). A line no vendor lists stays unordered
 * (the buyer sees it on the order). A bill line already ordered for its job orders only what is left.
 */
async function raiseSpecialOrders(em: EntityManager, actor: Actor, order: SalesOrder, lines: SalesOrderLine[]): Promise<void> {
  const special = lines.filter((l) => l.madeToOrder)
  if (!special.length) return
  const vendors = await preferredVendors(em, special.map((l) => l.itemId))
  const wanted: { line: SalesOrderLine; special: SpecialLine }[] = []
  for (const line of special) {
    if (!vendors.has(line.itemId)) continue
    let qty = line.qty
    let specJson: string | null = null
    if (line.bomLineId) {
      const bomLine = await em.findOne(BomLine, { where: { id: line.bomLineId }, lock: { mode: 'pessimistic_write' } })
      if (bomLine) {
        specJson = bomLine.specJson
        qty = Math.min(qty, Math.max(0, bomLine.qty - bomLine.orderedQty))
      }
    }
    if (qty > 0) wanted.push({ line, special: { itemId: line.itemId, qty, specJson, bomLineId: line.bomLineId } })
  }
  if (!wanted.length) return
  const job = order.jobId ? await em.findOneBy(Job, { id: order.jobId }) : null
  const { poLineIds } = await orderSpecialLines(
    em, actor,
    { warehouseId: order.warehouseId, jobId: order.jobId, notes: `Special order for sales order ${order.number}${job ? ` (job ${job.name})` : ''}`, joinDraft: false, source: 'sales_order' },
    wanted.map((w) => w.special),
  )
  for (const [i, w] of wanted.entries()) await em.update(SalesOrderLine, { id: w.line.id }, { poLineId: poLineIds[i] })
}

async function existingOrderOf(em: EntityManager, quoteId: number): Promise<number | null> {
  const [row]: { id: number }[] = await em.query('SELECT id FROM sales_orders WHERE quote_id = ? LOCK IN SHARE MODE', [quoteId])
  return row ? Number(row.id) : null
}

/** The quote is taken and its order made, in the caller's transaction; a quote already taken answers its order. */
export async function takeQuoteIn(em: EntityManager, actor: Actor, quoteId: number): Promise<{ orderId: number; created: boolean }> {
  const quote = await lockQuote(em, quoteId)
  if (quote.status === 'taken') {
    const existing = await existingOrderOf(em, quote.id)
    if (existing) return { orderId: existing, created: false }
  }
  ensureQuote('take', quote)
  const quoteLines = await em.find(QuoteLine, { where: { quoteId }, order: { lineNo: 'ASC' } })
  const { depositPercent } = await salesSettings(em)
  const deposit = depositRequired(quoteLines.filter((l) => l.madeToOrder).map((l) => l.extension), depositPercent)
  const order = await em.save(em.create(SalesOrder, {
    quoteId: quote.id, customerId: quote.customerId, jobId: quote.jobId, warehouseId: quote.warehouseId, status: 'booked',
    subtotal: quote.subtotal, taxAmount: quote.taxAmount, total: quote.amountDue,
    depositPercent, depositRequired: deposit, depositPaid: '0.00', createdBy: actor.userId,
  }))
  order.number = `SO-${new Date().getUTCFullYear()}-${String(order.id).padStart(5, '0')}`
  await em.update(SalesOrder, { id: order.id }, { number: order.number })
  const taxes = lineTaxShares(quoteLines.map((l) => l.extension), quote.taxRate, quote.taxAmount)
  const lines = await em.save(quoteLines.map((l, i) => em.create(SalesOrderLine, {
    salesOrderId: order.id, lineNo: i + 1, quoteLineId: l.id, bomLineId: l.bomLineId, itemId: l.itemId, description: l.description,
    qty: l.qty, unitPrice: l.unitPrice, extension: l.extension, tax: taxes[i], madeToOrder: l.madeToOrder,
    qtyReserved: 0, qtyPicked: 0, qtyHandedOver: 0, qtyReturned: 0, poLineId: null,
  })))
  await holdStock(em, actor, order, lines)
  await raiseSpecialOrders(em, actor, order, lines)
  await em.update(Quote, { id: quote.id }, { status: 'taken', takenAt: new Date() })
  await audit(em, actor, 'quote.taken', 'quote', quote.id, { number: quote.number, salesOrder: order.number })
  await audit(em, actor, 'sales_order.create', 'sales_order', order.id, { number: order.number, quote: quote.number, depositRequired: deposit })
  return { orderId: order.id, created: true }
}

export async function takeQuote(ds: DataSource, actor: Actor, quoteId: number): Promise<SalesOrderDetail> {
  const { orderId } = await inTransaction(ds, (em) => takeQuoteIn(em, actor, quoteId))
  return salesOrderDetail(ds, orderId)
}

/** Cancels an order nothing has left yet: its holds are released (once: a cancelled order is refused). */
export async function cancelSalesOrderIn(em: EntityManager, actor: Actor, id: number, reason: string): Promise<{ released: number }> {
  const order = await lockSalesOrder(em, id)
  if (order.status !== 'booked' && order.status !== 'ready') {
    throw AppError.conflict('sales_order_wrong_status', `A sales order that is ${order.status} cannot be cancelled.`, { params: { orderStatus: order.status } })
  }
  const lines = await em.find(SalesOrderLine, { where: { salesOrderId: id } })
  if (lines.some((l) => l.qtyHandedOver > 0)) {
    throw AppError.conflict('sales_order_wrong_status', 'Goods of this order have left; take a return instead.', { params: { orderStatus: 'handed_over' } })
  }
  // Held at the counter, on an open pick list, or picked and waiting: all of it goes back.
  const released = (await releaseReservations(em, actor, { docType: SALES_ORDER_DOC, docId: id })) + (await releaseFulfilment(em, actor, id))
  await em.update(SalesOrderLine, { salesOrderId: id }, { qtyReserved: 0 })
  await em.update(SalesOrder, { id }, { status: 'cancelled', cancelReason: reason, cancelledBy: actor.userId, cancelledAt: new Date() })
  await audit(em, actor, 'sales_order.cancel', 'sales_order', id, { number: order.number, reason, released })
  return { released }
}
