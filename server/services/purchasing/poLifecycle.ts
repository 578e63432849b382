// Status changes of a purchase order, each stamped with who and when and written to the audit log:
// editing a draft, approving, marking sent, cancelling and closing.
import type { EntityManager } from 'typeorm'
import type { PoLineInput, PoUpdateInput } from '../../../shared/schemas/purchasing.js'
import { allowedFrom, refusal, type PoAction } from '../../../shared/purchasing/poStatus.js'
import { MAX_LINE_QTY } from '../../../shared/purchasing/poMoney.js'
import { PurchaseOrder, PurchaseOrderLine, PurchaseSuggestion } from '../../entities/PurchaseOrder.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { lockAtVersion } from '../editVersion.js'
import { ensureDepositsPaid } from '../sales/salesDeposits.js'
import { manualLines } from './poCreation.js'
import { checkLineSizes, recomputeTotal } from './poWrite.js'

/**
 * Locks the order for a change and moves it to its next version. With `seenVersion` (the version the
 * screen showed), a change made meanwhile in another tab or by another buyer is refused, never overwritten.
 */
export function lockPo(em: EntityManager, id: number, seenVersion?: number): Promise<PurchaseOrder> {
  return lockAtVersion(em, PurchaseOrder, id, seenVersion, {
    notFound: () => AppError.notFound('po_not_found', 'That purchase order was not found.'),
    name: (po) => po.number,
  })
}

export function ensure(action: PoAction, po: PurchaseOrder): void {
  const why = refusal(action, po.status)
  if (why) throw AppError.conflict('po_wrong_status', why, { params: { poStatus: po.status, poAction: action, statuses: allowedFrom(action) } })
}

async function setStatus(em: EntityManager, actor: AuditActor, po: PurchaseOrder, status: 'approved' | 'sent' | 'cancelled' | 'closed', stamp: Partial<PurchaseOrder>, detail?: object) {
  const from = po.status
  await em.update(PurchaseOrder, { id: po.id }, { status, ...stamp })
  await audit(em, actor, `po.${status}`, 'purchase_order', po.id, { number: po.number, from, ...detail })
}

/**
 * Suggestions of a line that will not come go back to 'accepted'. Only one accepted reorder suggestion
 * may be open per item and warehouse, so when the buyer accepted a new one meanwhile, the quantity
 * joins that one and the old row is dismissed.
 */
async function reopenSuggestions(em: EntityManager, poLineId: number): Promise<void> {
  const rows = await em.find(PurchaseSuggestion, { where: { poLineId }, lock: { mode: 'pessimistic_write' } })
  for (const s of rows) {
    const open = s.source === 'reorder'
      ? await em.findOne(PurchaseSuggestion, { where: { itemId: s.itemId, warehouseId: s.warehouseId, status: 'accepted', source: 'reorder' }, lock: { mode: 'pessimistic_write' } })
      : null
    if (open) {
      await em.increment(PurchaseSuggestion, { id: open.id }, 'qty', s.qty)
      await em.update(PurchaseSuggestion, { id: s.id }, { status: 'dismissed', poLineId: null })
    } else {
      await em.update(PurchaseSuggestion, { id: s.id }, { status: 'accepted', poLineId: null })
    }
  }
}

/**
 * The rest of a line will not come: its suggestions go back to 'accepted' when nothing arrived, and a
 * special-order line's bill-of-materials line gives back the unreceived quantity.
 */
async function releaseLines(em: EntityManager, lines: PurchaseOrderLine[]): Promise<void> {
  for (const l of lines) {
    if (l.qtyReceived === 0) await reopenSuggestions(em, l.id)
    const unreceived = Math.max(0, l.qtyOrdered - l.qtyReceived)
    if (l.bomLineId && unreceived > 0) {
      await em.query('UPDATE bom_lines SET ordered_qty = GREATEST(0, ordered_qty - ?) WHERE id = ?', [unreceived, l.bomLineId])
    }
  }
}

export async function updateDraft(em: EntityManager, actor: AuditActor, id: number, input: PoUpdateInput): Promise<void> {
  const po = await lockPo(em, id, input.version)
  ensure('edit', po)
  const head: Partial<PurchaseOrder> = {}
  if (input.expectedDate !== undefined) head.expectedDate = input.expectedDate
  if (input.notes !== undefined) head.notes = input.notes
  if (Object.keys(head).length) await em.update(PurchaseOrder, { id }, head)
  for (const [i, change] of (input.lines ?? []).entries()) {
    const line = await em.findOneBy(PurchaseOrderLine, { id: change.id, poId: id })
    if (!line) throw AppError.badRequest('po_line_not_found', 'A line is not on this order.', { fields: { [`lines.${i}.id`]: problem('po_line_not_on_order') } })
    const packs = change.packsOrdered ?? line.packsOrdered
    const qty = packs * line.packQty
    if (qty > MAX_LINE_QTY) throw AppError.badRequest('line_too_large', 'A line is too large.', { fields: { [`lines.${i}.packsOrdered`]: problem('line_units_at_most', { max: MAX_LINE_QTY }) } })
    if (line.bomLineId && qty !== line.qtyOrdered) {
      await em.query('UPDATE bom_lines SET ordered_qty = GREATEST(0, ordered_qty + ?) WHERE id = ?', [qty - line.qtyOrdered, line.bomLineId])
    }
    await em.update(PurchaseOrderLine, { id: line.id }, { packsOrdered: packs, qtyOrdered: qty, unitCost: change.unitCost ?? line.unitCost })
  }
  await recomputeTotal(em, id)
  await audit(em, actor, 'po.update', 'purchase_order', id, input)
}

export async function addLine(em: EntityManager, actor: AuditActor, id: number, input: PoLineInput): Promise<void> {
  const po = await lockPo(em, id)
  ensure('edit', po)
  const [line] = await manualLines(em, po.vendorId, [input])
  checkLineSizes([line])
  const [{ n }]: { n: number | null }[] = await em.query('SELECT MAX(line_no) AS n FROM purchase_order_lines WHERE po_id = ?', [id])
  await em.save(em.create(PurchaseOrderLine, { ...line, poId: id, lineNo: (n ?? 0) + 1, qtyOrdered: line.packsOrdered * line.packQty, qtyReceived: 0, qtyDamaged: 0 }))
  await recomputeTotal(em, id)
  await audit(em, actor, 'po.line_add', 'purchase_order', id, input)
}

export async function removeLine(em: EntityManager, actor: AuditActor, id: number, lineId: number): Promise<void> {
  const po = await lockPo(em, id)
  ensure('edit', po)
  const line = await em.findOneBy(PurchaseOrderLine, { id: lineId, poId: id })
  if (!line) throw AppError.notFound('po_line_not_found', 'That line is not on this order.')
  await releaseLines(em, [line])
  await em.delete(PurchaseOrderLine, { id: lineId })
  await recomputeTotal(em, id)
  await audit(em, actor, 'po.line_remove', 'purchase_order', id, { lineId, itemId: line.itemId })
}

/** Approves the order as the approver saw it: `seenVersion` refuses an order changed since (or with edits saved meanwhile). */
export async function approve(em: EntityManager, actor: AuditActor, id: number, seenVersion?: number): Promise<void> {
  const po = await lockPo(em, id, seenVersion)
  ensure('approve', po)
  if (!(await em.countBy(PurchaseOrderLine, { poId: id }))) throw AppError.conflict('po_no_lines', 'Add a line before approving.')
  await setStatus(em, actor, po, 'approved', { approvedBy: actor.userId, approvedAt: new Date() })
}

/** Sent some other way (phone, portal, the exported sheet by hand). */
export async function markSent(em: EntityManager, actor: AuditActor, id: number, how: string): Promise<void> {
  const po = await lockPo(em, id)
  ensure('send', po)
  await ensureDepositsPaid(em, id)
  await setStatus(em, actor, po, 'sent', { sentBy: actor.userId, sentAt: new Date(), sendError: null }, { how })
}

export async function cancel(em: EntityManager, actor: AuditActor, id: number, reason: string | null): Promise<void> {
  const po = await lockPo(em, id)
  ensure('cancel', po)
  const lines = await em.findBy(PurchaseOrderLine, { poId: id })
  if (lines.some((l) => l.qtyReceived > 0)) throw AppError.conflict('po_received_cancel', 'Goods were received on this order: close it instead.')
  await releaseLines(em, lines)
  await setStatus(em, actor, po, 'cancelled', { cancelledBy: actor.userId, cancelledAt: new Date(), cancelReason: reason }, { reason })
}

/** The buyer ends the order: short (the rest will not come) or after a complete receipt. */
export async function close(em: EntityManager, actor: AuditActor, id: number, reason: string | null): Promise<void> {
  const po = await lockPo(em, id)
  ensure('close', po)
  await releaseLines(em, (await em.findBy(PurchaseOrderLine, { poId: id })).filter((l) => l.qtyReceived < l.qtyOrdered))
  await setStatus(em, actor, po, 'closed', { closedBy: actor.userId, closedAt: new Date(), closeReason: reason }, { reason })
}
