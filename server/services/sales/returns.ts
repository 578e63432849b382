// Returns at the counter: a contractor brings back unused, unopened packs of goods handed over on an order,
// within the supplier's window (days after the order's goods last left on a signed handover ticket, or after
// the order was booked when none has been signed; an admin setting). In one transaction,
// under the order's lock: the goods come back into a bin and lot of the order's warehouse through the stock
// service (a 'return' move each line), the order lines count them as returned, and the money goes back less
// the restocking fee (an admin setting): a refund by cash or cheque (recorded), by the card it was paid with
// (through the provider's SDK), or a credit on the contractor's account. A second submit of the same request
// (same Idempotency-Key) answers the first return; quantities beyond what left are refused, so no unit comes
// back twice.
import type { DataSource, EntityManager } from 'typeorm'
import { addMoney, compareMoney, parseMoney, subtractMoney } from '../../../shared/money.js'
import { toMinorUnits } from '../../../shared/payments/minorUnits.js'
import { returnFigures } from '../../../shared/sales/returnMoney.js'
import type { ReturnSettlement, ReturnTaken, SalesReturnInput, SalesReturnView } from '../../../shared/schemas/salesReturns.js'
import { Item } from '../../entities/Item.js'
import { SalesOrderLine } from '../../entities/SalesOrder.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import type { PayProvider } from '../payments/payProvider.js'
import { receiveReturn } from '../stock/stockService.js'
import { lockSalesOrder } from './salesOrderWrite.js'
import { salesSettings } from './salesSettings.js'

/** The doc_type of a return's stock moves. */
export const SALES_RETURN_DOC = 'sales_return'

type Actor = AuditActor & { userId: number }

const DAY_MS = 86_400_000

/** The contractor's account credit: Σ of its credit rows. */
export async function accountCredit(db: EntityManager | DataSource, customerId: number): Promise<string> {
  const [row]: { total: string | null }[] = await db.query('SELECT SUM(amount) AS total FROM account_credits WHERE customer_id = ?', [customerId])
  return parseMoney(String(row?.total ?? '0'))
}

/** The settled card payment of the order that can still give back `amount` (what it took, less every refund from it). */
async function cardToRefund(em: EntityManager, orderId: number, amount: string): Promise<{ id: number; reference: string; givenBack: string }> {
  const rows: { id: number; reference: string; amount: string; refunded_amount: string; returned: string | null }[] = await em.query(
    `SELECT p.id, p.reference, p.amount, p.refunded_amount, (SELECT SUM(r.refund) FROM sales_returns r WHERE r.payment_id = p.id) AS returned
       FROM payments p WHERE p.sales_order_id = ? AND p.method = 'card' AND p.status = 'settled' AND p.reference IS NOT NULL ORDER BY p.id FOR UPDATE`,
    [orderId],
  )
  let most = '0.00'
  for (const p of rows) {
    const givenBack = addMoney(String(p.refunded_amount), String(p.returned ?? '0'))
    const left = subtractMoney(String(p.amount), givenBack)
    if (compareMoney(left, amount) >= 0) return { id: Number(p.id), reference: p.reference, givenBack }
    if (compareMoney(left, most) > 0) most = left
  }
  throw AppError.conflict('return_card_short', `No card payment on this order can take back ${amount}; refund in cash or cheque, or as credit.`, {
    params: { available: parseMoney(most) }, fields: { settleBy: problem('return_card_short', { available: parseMoney(most) }) },
  })
}

export async function takeReturnIn(em: EntityManager, pay: PayProvider, actor: Actor, orderId: number, input: SalesReturnInput): Promise<ReturnTaken> {
  const order = await lockSalesOrder(em, orderId)
  if (order.status === 'cancelled') {
    throw AppError.conflict('sales_order_wrong_status', 'A cancelled order has nothing to return.', { params: { orderStatus: order.status } })
  }
  const policy = await salesSettings(em)
  // The window runs from the last signed handover (the goods left then), or from booking if none was signed.
  const [left] = (await em.query(
    "SELECT MAX(signed_at) AS at FROM handover_tickets WHERE sales_order_id = ? AND status = 'signed'", [orderId],
  )) as { at: Date | string | null }[]
  const opens = left?.at ? new Date(left.at) : new Date(order.createdAt)
  const closes = new Date(opens.getTime() + policy.returnWindowDays * DAY_MS)
  if (policy.returnWindowDays <= 0 || Date.now() > closes.getTime()) {
    throw AppError.conflict('return_window_closed', `Returns on ${order.number} closed ${policy.returnWindowDays} days after its goods left.`, { params: { days: policy.returnWindowDays } })
  }
  const orderLines = await em.find(SalesOrderLine, { where: { salesOrderId: orderId } })
  const items = new Map((await em.findBy(Item, orderLines.map((l) => ({ id: l.itemId })))).map((i) => [i.id, i]))
  const picked = input.lines.map((line, i) => {
    const field = (name: string, p: ReturnType<typeof problem>) => ({ [`lines.${i}.${name}`]: p })
    const ol = orderLines.find((l) => l.id === line.orderLineId)
    if (!ol) throw AppError.notFound('return_line_not_on_order', 'That line is not on this order.', { fields: field('orderLineId', problem('return_line_not_on_order')) })
    const item = items.get(ol.itemId)!
    if (ol.madeToOrder) throw AppError.conflict('return_made_to_order', `${item.sku} was made to order and does not come back.`, { params: { sku: item.sku }, fields: field('qty', problem('return_made_to_order', { sku: item.sku })) })
    if (!line.unopened) throw AppError.unprocessable('return_opened_packs', `Only unopened packs of ${item.sku} come back.`, { params: { sku: item.sku }, fields: field('unopened', problem('return_opened_packs', { sku: item.sku })) })
    const left = ol.qtyHandedOver - ol.qtyReturned
    if (line.qty > left) {
      throw AppError.conflict('return_over_handed', `Only ${left} of ${item.sku} left the counter and have not come back.`, { params: { sku: item.sku, left }, fields: field('qty', problem('return_over_handed', { sku: item.sku, left })) })
    }
    const pack = item.sellByPack && (item.caseQty ?? 0) > 1 ? Number(item.caseQty) : 1
    if (line.qty % pack !== 0) {
      throw AppError.unprocessable('return_whole_packs', `${item.sku} comes back in whole packs of ${pack}.`, { params: { sku: item.sku, pack }, fields: field('qty', problem('return_whole_packs', { sku: item.sku, pack })) })
    }
    return { line, ol, item }
  })
  const figures = returnFigures(picked.map(({ line, ol }) => ({ unitPrice: ol.unitPrice, lineQty: ol.qty, lineTax: ol.tax, qty: line.qty })), policy.restockingPercent)

  const card = input.settleBy === 'card' && compareMoney(figures.refund, '0') > 0 ? await cardToRefund(em, orderId, figures.refund) : null
  const made: { insertId: number } = await em.query(
    `INSERT INTO sales_returns (sales_order_id, customer_id, settle_by, reference, payment_id, goods, tax, restocking_percent, restocking_fee, refund, note, created_by)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    [orderId, order.customerId, input.settleBy, input.settleBy === 'cheque' ? input.reference : null, card?.id ?? null, figures.goods, figures.tax,
      policy.restockingPercent, figures.restockingFee, figures.refund, input.note, actor.userId],
  )
  const returnId = Number(made.insertId)
  const number = `RT-${new Date().getUTCFullYear()}-${String(returnId).padStart(5, '0')}`
  await em.query('UPDATE sales_returns SET number = ? WHERE id = ?', [number, returnId])

  // The bin must be one of the order's warehouse (the stock service refuses another's: bin_other_warehouse).
  const applied = await receiveReturn(em, actor, {
    warehouseId: order.warehouseId,
    lines: picked.map(({ line, ol }) => ({ itemId: ol.itemId, binId: line.binId, lotCode: line.lotCode, qty: line.qty, docLineId: ol.id })),
    doc: { docType: SALES_RETURN_DOC, docId: returnId },
    note: `${number} for ${order.number}`,
  })
  for (const [i, { line, ol }] of picked.entries()) {
    await em.query('INSERT INTO sales_return_lines (return_id, sales_order_line_id, item_id, qty, goods, tax, bin_id, lot_id) VALUES (?, ?, ?, ?, ?, ?, ?, ?)', [
      returnId, ol.id, ol.itemId, line.qty, figures.lines[i].goods, figures.lines[i].tax, line.binId, applied.moves[i].lotId,
    ])
    await em.query('UPDATE sales_order_lines SET qty_returned = qty_returned + ? WHERE id = ?', [line.qty, ol.id])
  }

  let reference = input.settleBy === 'cheque' ? input.reference : null
  if (card) {
    // Keyed by the payment and what it had given back before, so a retried transaction repeats this refund.
    const refund = await pay.refund({
      intentId: card.reference,
      amountMinor: toMinorUnits(figures.refund, pay.currency),
      idempotencyKey: `lumenyard-return-${card.id}-${card.givenBack}`,
      metadata: { salesOrderId: String(orderId), salesReturn: number },
    })
    reference = refund.id
    await em.query('UPDATE sales_returns SET reference = ? WHERE id = ?', [refund.id, returnId])
  }
  if (input.settleBy === 'credit' && compareMoney(figures.refund, '0') > 0) {
    await em.query('INSERT INTO account_credits (customer_id, amount, sales_return_id, note, created_by) VALUES (?, ?, ?, ?, ?)', [
      order.customerId, figures.refund, returnId, `${number} for ${order.number}`, actor.userId,
    ])
  }
  await audit(em, actor, 'sales_return.create', 'sales_order', orderId, {
    number, order: order.number, settleBy: input.settleBy, reference, goods: figures.goods, tax: figures.tax, fee: figures.restockingFee, refund: figures.refund,
    lines: picked.map(({ line, item }) => ({ sku: item.sku, qty: line.qty, binId: line.binId, lot: line.lotCode })),
  })
  const [view] = await returnsOf(em, orderId, returnId)
  return { ...view, accountCredit: await accountCredit(em, order.customerId) }
}

/** The returns taken on an order (or the one named), newest last. */
export async function returnsOf(db: EntityManager | DataSource, orderId: number, returnId?: number): Promise<SalesReturnView[]> {
  const rows: Record<string, unknown>[] = await db.query(
    `SELECT r.*, u.display_name AS created_name FROM sales_returns r LEFT JOIN users u ON u.id = r.created_by
      WHERE r.sales_order_id = ? ${returnId ? 'AND r.id = ?' : ''} ORDER BY r.id`,
    returnId ? [orderId, returnId] : [orderId],
  )
  if (!rows.length) return []
  const lines: Record<string, unknown>[] = await db.query(
    `SELECT l.*, i.sku, b.code AS bin_code, lo.code AS lot_code FROM sales_return_lines l JOIN items i ON i.id = l.item_id
       JOIN bins b ON b.id = l.bin_id LEFT JOIN lots lo ON lo.id = l.lot_id WHERE l.return_id IN (?) ORDER BY l.id`,
    [rows.map((r) => r.id)],
  )
  return rows.map((r) => ({
    id: Number(r.id), number: String(r.number), salesOrderId: orderId, settleBy: r.settle_by as ReturnSettlement, reference: r.reference === null ? null : String(r.reference),
    goods: String(r.goods), tax: String(r.tax), restockingPercent: String(r.restocking_percent), restockingFee: String(r.restocking_fee), refund: String(r.refund),
    note: r.note === null ? null : String(r.note), createdBy: r.created_name === null ? null : String(r.created_name), createdAt: new Date(r.created_at as Date).toISOString(),
    lines: lines.filter((l) => Number(l.return_id) === Number(r.id)).map((l) => ({
      orderLineId: Number(l.sales_order_line_id), sku: String(l.sku), qty: Number(l.qty), goods: String(l.goods), tax: String(l.tax),
      binCode: String(l.bin_code), lotCode: l.lot_code === null ? null : String(l.lot_code),
    })),
  }))
}
