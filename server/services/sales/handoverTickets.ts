// Handover tickets: what leaves a sales order at once, picked up at the counter or delivered. Made by the
// counter from what is picked and waiting (by bin and lot, as the pick left it held for the order), signed on
// a tablet (the signature kept as a PNG), and only then issued through the stock service: one 'pick' move
// per ticket line, from the order's picked hold. Signing twice, or twice at once, issues once: the order is
// locked first, then the ticket; a ticket found signed answers as it is. Every lock goes order → ticket.
import { IsNull, type EntityManager } from 'typeorm'
import { HANDOVER_DOC, ORDER_PICKED_DOC, ticketNumber } from '../../../shared/sales/handoverTerms.js'
import { SIGNATURE_PREFIX, type TicketCreateInput, type TicketSignInput } from '../../../shared/schemas/handover.js'
import { HandoverTicket, HandoverTicketLine } from '../../entities/HandoverTicket.js'
import { Item } from '../../entities/Item.js'
import { SalesOrder, SalesOrderLine } from '../../entities/SalesOrder.js'
import { StockReservation } from '../../entities/StockReservation.js'
import { AppError, problem } from '../../errors.js'
import { audit } from '../auditService.js'
import { lockDocumentBalances, pickReserved } from '../stock/stockReservations.js'
import type { StockActor } from '../stock/stockLedger.js'
import { settleOrderStatus } from './fulfilment.js'
import { lockSalesOrder } from './salesOrderWrite.js'

const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])

/** The signature pad's PNG: the PNG signature, then an IHDR chunk with a sensible size (PNG specification, ISO/IEC 15948 §5.2, §11.2.2). */
export function signaturePng(dataUrl: string): Buffer {
  const bytes = Buffer.from(dataUrl.slice(SIGNATURE_PREFIX.length), 'base64')
  const ok = bytes.length > 33 && bytes.subarray(0, 8).equals(PNG_MAGIC) && bytes.toString('latin1', 12, 16) === 'IHDR'
  const width = ok ? bytes.readUInt32BE(16) : 0
  const height = ok ? bytes.readUInt32BE(20) : 0
  if (!ok || width < 20 || height < 10 || width > 4000 || height > 4000) {
    throw AppError.badRequest('signature_invalid', 'The signature is not a PNG image of a sensible size.', { fields: { signature: problem('signature_invalid') } })
  }
  return bytes
}

/** Units of each order line on open tickets, per bin and lot (key `line:bin:lot`) and per line. */
async function onOpenTickets(em: EntityManager, orderId: number): Promise<{ byPlace: Map<string, number>; byLine: Map<number, number> }> {
  const rows = (await em.query(
    `SELECT tl.sales_order_line_id AS line_id, tl.bin_id, tl.lot_id, SUM(tl.qty) AS qty
       FROM handover_ticket_lines tl JOIN handover_tickets t ON t.id = tl.ticket_id
      WHERE t.sales_order_id = ? AND t.status = 'open'
      GROUP BY tl.sales_order_line_id, tl.bin_id, tl.lot_id`,
    [orderId],
  )) as { line_id: number; bin_id: number; lot_id: number | null; qty: string }[]
  const byPlace = new Map<string, number>()
  const byLine = new Map<number, number>()
  for (const r of rows) {
    byPlace.set(`${r.line_id}:${r.bin_id}:${r.lot_id ?? ''}`, Number(r.qty))
    byLine.set(Number(r.line_id), (byLine.get(Number(r.line_id)) ?? 0) + Number(r.qty))
  }
  return { byPlace, byLine }
}

export async function createTicket(em: EntityManager, actor: StockActor, orderId: number, input: TicketCreateInput): Promise<{ id: number; number: string }> {
  const order = await lockSalesOrder(em, orderId)
  if (order.status !== 'booked' && order.status !== 'ready') {
    throw AppError.conflict('sales_order_wrong_status', `A sales order that is ${order.status} has nothing to hand over.`, { params: { orderStatus: order.status } })
  }
  const lines = await em.find(SalesOrderLine, { where: { salesOrderId: orderId }, lock: { mode: 'pessimistic_write' } })
  const open = await onOpenTickets(em, orderId)
  const picked = await em.find(StockReservation, { where: { docType: ORDER_PICKED_DOC, docId: orderId }, order: { id: 'ASC' } })
  const wanted = new Map<number, number>()
  for (const l of input.lines) wanted.set(l.salesOrderLineId, (wanted.get(l.salesOrderLineId) ?? 0) + l.qty)
  const places: Omit<HandoverTicketLine, 'id' | 'ticketId' | 'moveId'>[] = []
  for (const [lineId, qty] of wanted) {
    const line = lines.find((l) => l.id === lineId)
    if (!line) throw AppError.badRequest('sales_line_not_found', 'That line is not on this order.', { fields: { lines: problem('sales_line_not_found') } })
    const waiting = line.qtyPicked - line.qtyHandedOver - (open.byLine.get(line.id) ?? 0)
    if (qty > waiting) {
      const item = await em.findOneByOrFail(Item, { id: line.itemId })
      const params = { sku: item.sku, left: Math.max(0, waiting) }
      throw AppError.conflict('ticket_over', `Only ${params.left} of ${item.sku} are picked and waiting for this order.`, { params })
    }
    // What the pick left held for this line, per bin and lot, less what open tickets already list there.
    const held = new Map<string, { itemId: number; binId: number; lotId: number | null; qty: number }>()
    for (const r of picked.filter((p) => p.docLineId === line.id)) {
      const key = `${line.id}:${r.binId}:${r.lotId ?? ''}`
      const place = held.get(key) ?? { itemId: r.itemId, binId: r.binId, lotId: r.lotId, qty: 0 }
      place.qty += r.qty
      held.set(key, place)
    }
    let rest = qty
    for (const [key, place] of held) {
      const free = place.qty - (open.byPlace.get(key) ?? 0)
      if (rest === 0 || free <= 0) continue
      const q = Math.min(free, rest)
      places.push({ salesOrderLineId: line.id, itemId: place.itemId, binId: place.binId, lotId: place.lotId, qty: q })
      rest -= q
    }
    if (rest > 0) throw AppError.conflict('reservation_missing', 'The picked stock held for this order does not cover the ticket.')
  }
  const ticket = await em.save(em.create(HandoverTicket, {
    salesOrderId: orderId, kind: input.kind, status: 'open', deliverTo: input.kind === 'delivery' ? input.deliverTo : null, note: input.note,
    createdBy: actor.userId,
  }))
  const number = ticketNumber(ticket.id)
  await em.update(HandoverTicket, { id: ticket.id }, { number })
  await em.insert(HandoverTicketLine, places.map((p) => ({ ...p, ticketId: ticket.id, moveId: null })))
  await audit(em, actor, 'handover_ticket.create', 'handover_ticket', ticket.id, { number, order: order.number, kind: input.kind, qty: places.reduce((a, p) => a + p.qty, 0) })
  return { id: ticket.id, number }
}

/** The order, then the ticket, locked in that order (the one every ticket change keeps). */
async function lockTicket(em: EntityManager, id: number): Promise<{ order: SalesOrder; ticket: HandoverTicket }> {
  const unlocked = await em.findOneBy(HandoverTicket, { id })
  if (!unlocked) throw AppError.notFound('ticket_not_found', 'That handover ticket was not found.')
  const order = await lockSalesOrder(em, unlocked.salesOrderId)
  const ticket = await em.findOneOrFail(HandoverTicket, { where: { id }, lock: { mode: 'pessimistic_write' } })
  return { order, ticket }
}

export interface SignAnswer { id: number; number: string; status: 'signed'; issued: number; moves: number; orderStatus: string; replayed: boolean }

/** Signs the ticket and issues its stock, once. A ticket already signed answers as it is (replayed), issuing nothing. */
export async function signTicket(em: EntityManager, actor: StockActor, id: number, input: TicketSignInput): Promise<SignAnswer> {
  const png = signaturePng(input.signature)
  const { order, ticket } = await lockTicket(em, id)
  const number = ticket.number ?? ticketNumber(ticket.id)
  if (ticket.status === 'signed') {
    const fresh = await em.findOneByOrFail(SalesOrder, { id: order.id })
    return { id, number, status: 'signed', issued: 0, moves: 0, orderStatus: fresh.status, replayed: true }
  }
  if (ticket.status !== 'open') throw AppError.conflict('ticket_wrong_status', `Ticket ${number} is ${ticket.status}.`, { params: { ticketStatus: ticket.status } })
  const lines = await em.find(HandoverTicketLine, { where: { ticketId: id }, order: { id: 'ASC' } })
  await lockDocumentBalances(em, { docType: ORDER_PICKED_DOC, docId: order.id })
  const byOrderLine = new Map<number, number>()
  let moves = 0
  for (const line of lines) {
    let rest = line.qty
    let firstMove: string | null = null
    const holds = await em.find(StockReservation, {
      where: { docType: ORDER_PICKED_DOC, docId: order.id, docLineId: line.salesOrderLineId, binId: line.binId, lotId: line.lotId ?? IsNull() },
      order: { id: 'ASC' },
    })
    for (const h of holds) {
      if (rest === 0) break
      const q = Math.min(rest, h.qty)
      const applied = await pickReserved(em, actor, { reservationId: h.id, qty: q, doc: { docType: HANDOVER_DOC, docId: id, docLineId: line.id }, note: `${number} for ${order.number}` })
      firstMove ??= applied.moves[0].id
      moves++
      rest -= q
    }
    if (rest > 0) throw AppError.conflict('reservation_missing', `The picked stock held for ${order.number} no longer covers ${number}; nothing was issued.`)
    await em.update(HandoverTicketLine, { id: line.id }, { moveId: firstMove })
    byOrderLine.set(line.salesOrderLineId, (byOrderLine.get(line.salesOrderLineId) ?? 0) + line.qty)
  }
  for (const [lineId, qty] of byOrderLine) await em.query('UPDATE sales_order_lines SET qty_handed_over = qty_handed_over + ? WHERE id = ?', [qty, lineId])
  await em.update(HandoverTicket, { id }, { status: 'signed', signerName: input.signerName, signaturePng: png, signedBy: actor.userId, signedAt: new Date() })
  const orderStatus = await settleOrderStatus(em, order)
  const issued = [...byOrderLine.values()].reduce((a, b) => a + b, 0)
  await audit(em, actor, 'handover_ticket.sign', 'handover_ticket', id, { number, order: order.number, signerName: input.signerName, issued, orderStatus })
  return { id, number, status: 'signed', issued, moves, orderStatus, replayed: false }
}

/** An open ticket made by mistake: voided, its goods stay picked and waiting. */
export async function voidTicket(em: EntityManager, actor: StockActor, id: number): Promise<{ id: number; status: 'voided' }> {
  const { order, ticket } = await lockTicket(em, id)
  if (ticket.status !== 'open') throw AppError.conflict('ticket_wrong_status', `Ticket ${ticket.number} is ${ticket.status}.`, { params: { ticketStatus: ticket.status } })
  await em.update(HandoverTicket, { id }, { status: 'voided', voidedBy: actor.userId, voidedAt: new Date() })
  await audit(em, actor, 'handover_ticket.void', 'handover_ticket', id, { number: ticket.number, order: order.number })
  return { id, status: 'voided' }
}
