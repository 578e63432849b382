// Receiving against a purchase order: good units go into bins (and lots) through the stock service,
// which blends the moving-average cost; damaged units are recorded and stay owed; made-to-order lines
// raised for a sales order are held for that order where they were received (so nobody else's pick list
// takes them), the others are issued straight to their job in the same transaction. The PO row is
// locked first, so two submissions racing for the last open units apply one after the other.
import type { EntityManager } from 'typeorm'
import type { ReceiveInput, ReceiveLineInput } from '../../../shared/schemas/purchasing.js'
import type { ReceiveResult } from '../../../shared/schemas/purchasingViews.js'
import { checkLineReceipt, type ReceiptVariance } from '../../../shared/purchasing/receiptRules.js'
import { statusAfterReceipt } from '../../../shared/purchasing/poStatus.js'
import { Item } from '../../entities/Item.js'
import { PurchaseOrder, PurchaseOrderLine } from '../../entities/PurchaseOrder.js'
import { PurchaseReceipt, PurchaseReceiptLine } from '../../entities/PurchaseReceipt.js'
import { AppError, problem, type FieldProblems } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { purchasingSettings } from '../appSettings.js'
import { findOrCreateLot, issue, receive, type ReceiptLine } from '../stock/stockService.js'
import { reserve } from '../stock/stockReservations.js'
import { SALES_ORDER_DOC } from '../sales/salesOrderWrite.js'
import { ensure, lockPo } from './poLifecycle.js'
import { loadItems } from './poWrite.js'
import { receiptById } from './poReceipts.js'

interface Entry extends ReceiveLineInput {
  index: number
  line: PurchaseOrderLine
  item: Item
  lotId: number | null
  variance: ReceiptVariance | null
}

function checkEntries(input: ReceiveInput, lines: Map<number, PurchaseOrderLine>, items: Map<number, Item>): Entry[] {
  const fields: FieldProblems = {}
  const entries: Entry[] = []
  input.lines.forEach((l, index) => {
    const line = lines.get(l.poLineId)
    if (!line) return void (fields[`lines.${index}.poLineId`] = problem('po_line_not_on_order'))
    const item = items.get(line.itemId)!
    if (item.matchLot && !item.madeToOrder && l.qty > 0 && !l.lotCode) fields[`lines.${index}.lotCode`] = problem('lot_needed_for_tint')
    entries.push({ ...l, index, line, item, lotId: null, variance: null })
  })
  if (Object.keys(fields).length) throw AppError.badRequest('lines_need_attention', 'Some lines need attention.', { fields })
  return entries
}

/** Per PO line: all its entries together must fit what is open (plus the over-receipt allowance). */
function checkQuantities(entries: Entry[]): void {
  const conflicts: FieldProblems = {}
  const missing: FieldProblems = {}
  let firstOver = ''
  for (const lineId of new Set(entries.map((e) => e.poLineId))) {
    const mine = entries.filter((e) => e.poLineId === lineId)
    const verdict = checkLineReceipt({
      qtyOrdered: mine[0].line.qtyOrdered,
      qtyReceived: mine[0].line.qtyReceived,
      qty: mine.reduce((s, e) => s + e.qty, 0),
      damagedQty: mine.reduce((s, e) => s + e.damagedQty, 0),
      hasReason: mine.some((e) => !!e.reason),
    })
    const at = `lines.${mine[0].index}.${verdict.ok ? '' : verdict.field}`
    if (!verdict.ok) {
      ;(verdict.field === 'qty' ? conflicts : missing)[at] = verdict.problem
      if (verdict.field === 'qty') firstOver ||= verdict.message
    }
    else for (const e of mine) e.variance = e.damagedQty > 0 ? 'damaged' : verdict.variance
  }
  if (Object.keys(missing).length) throw AppError.badRequest('lines_need_attention', 'Some lines need attention.', { fields: missing })
  const over = Object.values(conflicts)[0]
  if (over) throw new AppError(409, 'over_receipt', firstOver, { params: over.params, fields: conflicts })
}

async function postStock(em: EntityManager, actor: AuditActor, po: PurchaseOrder, entries: Entry[]): Promise<{ batchId: string | null; held: Set<Entry> }> {
  const stocked = entries.filter((e) => e.qty > 0)
  if (!stocked.length) return { batchId: null, held: new Set() }
  const today = new Date().toISOString().slice(0, 10)
  for (const e of stocked) {
    if (e.lotCode) e.lotId = (await findOrCreateLot(em, e.item.id, e.lotCode, { receivedAt: today, vendorId: po.vendorId })).id
  }
  const lines: ReceiptLine[] = stocked.map((e) => ({ itemId: e.item.id, binId: e.binId, lotId: e.lotId, qty: e.qty, unitCost: e.line.unitCost, docLineId: e.line.id }))
  const doc = { docType: 'purchase_order', docId: po.id }
  const applied = await receive(em, { userId: actor.userId }, { warehouseId: po.warehouseId, lines, doc, note: `Received on ${po.number}` })
  // A special order raised for a sales order is held for that order where it was received (it waits for the
  // order's pick list and the contractor's signature, and nobody else can pick it); the rest goes to its job.
  const forOrders = await heldForSalesOrders(em, actor, po, stocked.filter((e) => e.item.madeToOrder))
  const special = stocked.filter((e) => e.item.madeToOrder && !forOrders.has(e))
  if (special.length) {
    // Made to order: straight out to the job (or the order itself when it has no job), never left on hand.
    await issue(em, { userId: actor.userId }, {
      lines: special.map((e) => ({ itemId: e.item.id, binId: e.binId, lotId: e.lotId, qty: e.qty, docLineId: e.line.bomLineId ?? e.line.id })),
      doc: po.jobId ? { docType: 'job', docId: po.jobId } : doc,
      reason: 'special_order',
      note: `Made to order, ${po.number}`,
    })
  }
  return { batchId: applied.batchId, held: forOrders }
}

/** The entries whose PO line belongs to a standing sales order's line: held for it (reserved, qty_reserved up, audited). */
async function heldForSalesOrders(em: EntityManager, actor: AuditActor, po: PurchaseOrder, special: Entry[]): Promise<Set<Entry>> {
  const held = new Set<Entry>()
  if (!special.length) return held
  const rows: { id: number; sales_order_id: number; po_line_id: number; number: string }[] = await em.query(
    `SELECT l.id, l.sales_order_id, l.po_line_id, o.number FROM sales_order_lines l JOIN sales_orders o ON o.id = l.sales_order_id
      WHERE l.po_line_id IN (?) AND o.status <> 'cancelled' ORDER BY l.id FOR UPDATE`,
    [special.map((e) => e.line.id)],
  )
  // The first sales order line per PO line (rows come in line order).
  const byPoLine = new Map<number, (typeof rows)[number]>()
  for (const r of rows) if (!byPoLine.has(Number(r.po_line_id))) byPoLine.set(Number(r.po_line_id), r)
  for (const e of special) {
    const line = byPoLine.get(e.line.id)
    if (!line) continue
    const orderId = Number(line.sales_order_id)
    await reserve(em, { userId: actor.userId }, {
      doc: { docType: SALES_ORDER_DOC, docId: orderId },
      lines: [{ itemId: e.item.id, binId: e.binId, lotId: e.lotId, qty: e.qty, docLineId: Number(line.id) }],
    })
    await em.query('UPDATE sales_order_lines SET qty_reserved = qty_reserved + ? WHERE id = ?', [e.qty, line.id])
    await audit(em, actor, 'sales_order.special_held', 'sales_order', orderId, {
      number: line.number, po: po.number, sku: e.item.sku, qty: e.qty, binId: e.binId, lotId: e.lotId,
    })
    held.add(e)
  }
  return held
}

async function advance(em: EntityManager, actor: AuditActor, po: PurchaseOrder): Promise<PurchaseOrder['status']> {
  const lines = await em.findBy(PurchaseOrderLine, { poId: po.id })
  const next = statusAfterReceipt(lines)
  const now = new Date()
  if (next === 'partly_received') {
    if (po.status !== next) await em.update(PurchaseOrder, { id: po.id }, { status: next })
    return next
  }
  await em.update(PurchaseOrder, { id: po.id }, { status: 'received', receivedBy: actor.userId, receivedAt: now })
  await audit(em, actor, 'po.received', 'purchase_order', po.id, { number: po.number })
  if (!(await purchasingSettings(em)).autoCloseOnReceipt) return 'received'
  await em.update(PurchaseOrder, { id: po.id }, { status: 'closed', closedBy: actor.userId, closedAt: now, closeReason: 'Everything ordered was received.' })
  await audit(em, actor, 'po.closed', 'purchase_order', po.id, { number: po.number, reason: 'complete' })
  return 'closed'
}

export async function receivePurchaseOrder(em: EntityManager, actor: AuditActor, poId: number, input: ReceiveInput): Promise<ReceiveResult> {
  const po = await lockPo(em, poId)
  ensure('receive', po)
  const poLines = await em.find(PurchaseOrderLine, { where: { poId }, lock: { mode: 'pessimistic_write' } })
  const items = await loadItems(em, poLines.map((l) => l.itemId))
  const entries = checkEntries(input, new Map(poLines.map((l) => [l.id, l])), items)
  checkQuantities(entries)
  const { batchId, held: heldEntries } = await postStock(em, actor, po, entries)
  const receipt = await em.save(em.create(PurchaseReceipt, { poId, receivedBy: actor.userId, note: input.note, batchId }))
  for (const e of entries) {
    await em.insert(PurchaseReceiptLine, {
      receiptId: receipt.id, poLineId: e.line.id, itemId: e.item.id, binId: e.binId, lotId: e.lotId, qty: e.qty, qtyDamaged: e.damagedQty,
      variance: e.variance, reason: e.reason, issuedToJobId: e.item.madeToOrder && e.qty > 0 && !heldEntries.has(e) ? po.jobId : null,
    })
    await em.increment(PurchaseOrderLine, { id: e.line.id }, 'qtyReceived', e.qty)
    if (e.damagedQty) await em.increment(PurchaseOrderLine, { id: e.line.id }, 'qtyDamaged', e.damagedQty)
  }
  await audit(em, actor, 'po.receipt', 'purchase_order', poId, { receiptId: receipt.id, lines: entries.length })
  const status = await advance(em, actor, po)
  return { receipt: await receiptById(em, receipt.id), status }
}
