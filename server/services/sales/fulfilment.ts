// Fulfilling a sales order: the counter sends what the order holds to the warehouse as a pick list (the
// order's holds become the list's reservations, passed on, never reserved twice; what an earlier pick left
// short is allocated afresh by bin and lot). Each scanner confirmation counts on the order line's
// qty_picked. Completing the list does not issue the stock: the confirmed units stay held for the order
// (ORDER_PICKED_DOC) until a signed handover ticket issues them; what was not found is given back and
// backordered (a purchase suggestion for the buyer). The order is then ready and the contractor is told.
import { In, type EntityManager } from 'typeorm'
import { ORDER_PICKED_DOC } from '../../../shared/sales/handoverTerms.js'
import type { SalesOrderStatus } from '../../../shared/sales/salesOrderTerms.js'
import { Item } from '../../entities/Item.js'
import { PickList, PickListLine } from '../../entities/PickList.js'
import { PurchaseSuggestion } from '../../entities/PurchaseOrder.js'
import { SalesOrder, SalesOrderLine } from '../../entities/SalesOrder.js'
import { StockReservation } from '../../entities/StockReservation.js'
import { AppError, problem } from '../../errors.js'
import { audit } from '../auditService.js'
import { PICK_DOC } from '../picking/pickListCreate.js'
import { pickNumber } from '../picking/pickListLocks.js'
import { StockPool } from '../picking/pickPlanning.js'
import { passReservation } from '../stock/reservationHandover.js'
import { lockDocumentBalances, releaseReservations, reserve, type ReserveLine } from '../stock/stockReservations.js'
import type { StockActor } from '../stock/stockLedger.js'
import { lockSalesOrder, SALES_ORDER_DOC } from './salesOrderWrite.js'

const OPEN_LIST = ['draft', 'released', 'picking']

/** Units of a line still to be picked: ordered, less cancelled, less picked already. */
export const leftToPick = (l: SalesOrderLine) => l.qty - l.qtyCancelled - l.qtyPicked

/** Booked while goods are still to come, ready while picked goods wait at the counter, handed over when every line has left or was cancelled. */
export function orderStatusOf(lines: SalesOrderLine[]): Exclude<SalesOrderStatus, 'cancelled'> {
  if (lines.every((l) => l.qtyHandedOver >= l.qty - l.qtyCancelled)) return 'handed_over'
  return lines.some((l) => l.qtyPicked > l.qtyHandedOver) ? 'ready' : 'booked'
}

/** Writes the order's status from its lines (and when it became ready or closed). */
export async function settleOrderStatus(em: EntityManager, order: SalesOrder): Promise<SalesOrderStatus> {
  const lines = await em.find(SalesOrderLine, { where: { salesOrderId: order.id } })
  const status = orderStatusOf(lines)
  const becameReady = status === 'ready' && order.status !== 'ready'
  await em.update(SalesOrder, { id: order.id }, {
    status,
    ...(becameReady && { readyAt: new Date(), readyMailedAt: null }),
    ...(status === 'handed_over' && { closedAt: new Date() }),
  })
  return status
}

async function openListOf(em: EntityManager, orderId: number): Promise<PickList | null> {
  return em.findOne(PickList, { where: { salesOrderId: orderId, status: In(OPEN_LIST) } })
}

/**
 * Makes the order's pick list: per line what is left to pick, first from the order's own holds (passed on
 * to the list), then from what the warehouse has free now (reserved for the list). Refused while another
 * list of the order is open, or when nothing can be picked.
 */
export async function sendOrderToPick(em: EntityManager, actor: StockActor, orderId: number): Promise<{ pickListId: number; lines: number; qty: number }> {
  const order = await lockSalesOrder(em, orderId)
  if (order.status !== 'booked' && order.status !== 'ready') {
    throw AppError.conflict('sales_order_wrong_status', `A sales order that is ${order.status} cannot be picked.`, { params: { orderStatus: order.status } })
  }
  const open = await openListOf(em, orderId)
  if (open) throw AppError.conflict('order_pick_open', `${pickNumber(open.id)} for this order is still open.`, { params: { number: pickNumber(open.id) } })
  const lines = await em.find(SalesOrderLine, { where: { salesOrderId: orderId }, order: { lineNo: 'ASC' }, lock: { mode: 'pessimistic_write' } })
  await lockDocumentBalances(em, { docType: SALES_ORDER_DOC, docId: orderId })
  const holds = await em.find(StockReservation, { where: { docType: SALES_ORDER_DOC, docId: orderId }, order: { id: 'ASC' } })
  const list = await em.save(em.create(PickList, {
    bomId: null, jobId: order.jobId, salesOrderId: order.id, warehouseId: order.warehouseId, status: 'released',
    // No note: the pick screens name the order themselves, in the picker's language.
    note: null, createdBy: actor.userId, releasedBy: actor.userId, releasedAt: new Date(),
  }))
  const items = new Map((await em.findBy(Item, { id: In([...new Set(lines.map((l) => l.itemId))]) })).map((i) => [i.id, i]))
  const pool = new StockPool(em)
  const fresh: ReserveLine[] = []
  let count = 0
  let total = 0
  const addLine = async (line: SalesOrderLine, binId: number, lotId: number | null, qty: number) => {
    const pl = await em.save(em.create(PickListLine, {
      pickListId: list.id, bomLineId: line.bomLineId, salesOrderLineId: line.id, itemId: line.itemId, substituteForItemId: null,
      binId, lotId, qty, confirmedQty: 0, shortQty: 0, issuedQty: 0,
    }))
    count++
    total += qty
    return pl
  }
  try {
    for (const line of lines) {
      let want = leftToPick(line)
      for (const hold of holds.filter((h) => h.docLineId === line.id)) {
        if (want <= 0) break
        const qty = Math.min(want, hold.qty)
        const pl = await addLine(line, hold.binId, hold.lotId, qty)
        await passReservation(em, hold.id, { docType: PICK_DOC, docId: list.id, docLineId: pl.id }, qty)
        want -= qty
      }
      if (want <= 0) continue
      const got = await pool.take(line.itemId, order.warehouseId, want, items.get(line.itemId)?.matchLot ?? false)
      for (const a of got.lines) {
        const pl = await addLine(line, Number(a.binId), a.lotId === null ? null : Number(a.lotId), a.qty)
        fresh.push({ itemId: line.itemId, binId: pl.binId, lotId: pl.lotId, qty: a.qty, docLineId: pl.id })
      }
    }
    if (fresh.length) await reserve(em, actor, { doc: { docType: PICK_DOC, docId: list.id }, lines: fresh })
  } catch (err) {
    if (err instanceof AppError && err.code === 'insufficient_stock') {
      throw AppError.conflict('stock_taken', `The stock changed while this pick list was being made: ${err.message} Nothing was reserved; try again.`)
    }
    throw err
  }
  if (!count) {
    throw AppError.conflict('nothing_to_pick_order', `Nothing of ${order.number} can be picked now: it is all picked, or the warehouse has none free.`, { params: { number: order.number ?? '' } })
  }
  // What the order still holds at the counter after passing its holds on.
  for (const line of lines) {
    const [row] = (await em.query('SELECT COALESCE(SUM(qty), 0) AS q FROM stock_reservations WHERE doc_type = ? AND doc_id = ? AND doc_line_id = ?', [SALES_ORDER_DOC, orderId, line.id])) as { q: string }[]
    if (Number(row.q) !== line.qtyReserved) await em.update(SalesOrderLine, { id: line.id }, { qtyReserved: Number(row.q) })
  }
  await audit(em, actor, 'sales_order.pick_sent', 'sales_order', orderId, { number: order.number, pickList: pickNumber(list.id), lines: count, qty: total })
  await audit(em, actor, 'pick_list.create', 'pick_list', list.id, { salesOrderId: orderId })
  return { pickListId: list.id, lines: count, qty: total }
}

/** A confirmation on a sales order's list counts on the order line at once. */
export async function countOrderPick(em: EntityManager, line: PickListLine, qty: number): Promise<void> {
  if (line.salesOrderLineId === null || qty <= 0) return
  await em.query('UPDATE sales_order_lines SET qty_picked = qty_picked + ? WHERE id = ?', [qty, line.salesOrderLineId])
}

/** The buyer's suggestion for units a pick could not find. */
async function raiseBackorder(em: EntityManager, actor: StockActor, order: SalesOrder, line: SalesOrderLine, qty: number, listId: number): Promise<void> {
  const item = await em.findOneByOrFail(Item, { id: line.itemId })
  await em.save(em.create(PurchaseSuggestion, {
    itemId: item.id, warehouseId: order.warehouseId, vendorId: null, qty, status: 'accepted', source: 'backorder', poLineId: null,
    explanation: `Backorder: ${qty} ${item.stockUnit} of ${item.sku} short when picking ${pickNumber(listId)} for sales order ${order.number}.`,
    acceptedBy: actor.userId,
  }))
}

/**
 * Completes a sales order's list (called by the picking service once open lines are closed): the confirmed
 * units pass to the order (held, waiting at the counter), the rest is given back; lines that came up short
 * are backordered; the order's status follows. Nothing is issued here: the handover ticket does that.
 */
export async function completeOrderPick(em: EntityManager, actor: StockActor, list: PickList, lines: PickListLine[]): Promise<{ released: number; backordered: number }> {
  const order = await lockSalesOrder(em, list.salesOrderId!)
  await lockDocumentBalances(em, { docType: PICK_DOC, docId: list.id })
  for (const line of lines) {
    if (line.confirmedQty <= 0 || line.salesOrderLineId === null) continue
    const r = await em.findOneBy(StockReservation, { docType: PICK_DOC, docId: list.id, docLineId: line.id })
    if (!r) throw AppError.conflict('reservation_missing', `The stock held for a line of ${pickNumber(list.id)} is gone; it cannot be handed to the order.`)
    await passReservation(em, r.id, { docType: ORDER_PICKED_DOC, docId: order.id, docLineId: line.salesOrderLineId }, line.confirmedQty)
  }
  const released = await releaseReservations(em, actor, { docType: PICK_DOC, docId: list.id })
  await em.update(PickList, { id: list.id }, { status: 'picked', pickedBy: actor.userId, pickedAt: new Date() })
  const orderLines = await em.find(SalesOrderLine, { where: { salesOrderId: order.id }, lock: { mode: 'pessimistic_write' } })
  const onList = new Set(lines.map((l) => l.salesOrderLineId))
  let backordered = 0
  for (const line of orderLines) {
    if (!onList.has(line.id) || line.madeToOrder) continue
    const short = Math.max(0, leftToPick(line) - line.qtyReserved)
    if (short > line.qtyBackordered) await raiseBackorder(em, actor, order, line, short - line.qtyBackordered, list.id)
    if (short !== line.qtyBackordered) await em.update(SalesOrderLine, { id: line.id }, { qtyBackordered: short })
    backordered += short
  }
  const status = await settleOrderStatus(em, order)
  await audit(em, actor, 'pick_list.picked', 'pick_list', list.id, { salesOrderId: order.id, released, backordered })
  await audit(em, actor, 'sales_order.picked', 'sales_order', order.id, { number: order.number, pickList: pickNumber(list.id), status, backordered })
  return { released, backordered }
}

/**
 * Takes what is still to come of a line off the order (the contractor no longer wants the backorder): held
 * units are given back. What is picked or handed over stays. The order may close.
 */
export async function cancelLineRest(em: EntityManager, actor: StockActor, orderId: number, lineId: number): Promise<{ cancelled: number; status: SalesOrderStatus }> {
  const order = await lockSalesOrder(em, orderId)
  if (order.status !== 'booked' && order.status !== 'ready') {
    throw AppError.conflict('sales_order_wrong_status', `A sales order that is ${order.status} cannot change.`, { params: { orderStatus: order.status } })
  }
  const open = await openListOf(em, orderId)
  if (open) throw AppError.conflict('order_pick_open', `${pickNumber(open.id)} for this order is still open.`, { params: { number: pickNumber(open.id) } })
  const line = await em.findOne(SalesOrderLine, { where: { id: lineId, salesOrderId: orderId }, lock: { mode: 'pessimistic_write' } })
  if (!line) throw AppError.badRequest('sales_line_not_found', 'That line is not on this order.', { fields: { lineId: problem('sales_line_not_found') } })
  const rest = leftToPick(line)
  if (rest <= 0) throw AppError.conflict('nothing_left_on_line', 'Everything on this line is picked already.')
  await releaseReservations(em, actor, { docType: SALES_ORDER_DOC, docId: orderId, docLineId: line.id })
  await em.update(SalesOrderLine, { id: line.id }, { qtyCancelled: line.qtyCancelled + rest, qtyReserved: 0, qtyBackordered: 0 })
  const status = await settleOrderStatus(em, order)
  await audit(em, actor, 'sales_order.line_rest_cancelled', 'sales_order', orderId, { number: order.number, lineNo: line.lineNo, qty: rest, status })
  return { cancelled: rest, status }
}

/** Cancelling an order also gives back what its open pick lists and its picked goods hold, and closes those lists. */
export async function releaseFulfilment(em: EntityManager, actor: StockActor, orderId: number): Promise<number> {
  let released = await releaseReservations(em, actor, { docType: ORDER_PICKED_DOC, docId: orderId })
  const lists = await em.find(PickList, { where: { salesOrderId: orderId, status: In(OPEN_LIST) }, lock: { mode: 'pessimistic_write' } })
  for (const list of lists) {
    released += await releaseReservations(em, actor, { docType: PICK_DOC, docId: list.id })
    await em.update(PickList, { id: list.id }, { status: 'cancelled', cancelledBy: actor.userId, cancelledAt: new Date(), cancelReason: 'Sales order cancelled' })
  }
  return released
}
