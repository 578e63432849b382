// Passing held stock from one document to the next without reserving it twice: a sales order's hold
// becomes its pick list's reservation, and a completed pick's confirmed units become the order's
// "picked, waiting at the counter" hold. The balance's reserved does not change (the same units stay held);
// only the reservation row's document changes, or splits when part of it passes on.
import type { EntityManager } from 'typeorm'
import { StockReservation } from '../../entities/StockReservation.js'
import { AppError } from '../../errors.js'
import type { DocRef } from './stockLedger.js'

/** Passes `qty` of one reservation to another document line; the rest (if any) stays with the old one. Answers the passed row. */
export async function passReservation(em: EntityManager, reservationId: number, to: DocRef, qty: number): Promise<StockReservation> {
  const r = await em.findOne(StockReservation, { where: { id: reservationId }, lock: { mode: 'pessimistic_write' } })
  if (!r) throw AppError.conflict('reservation_released', 'That reservation was released meanwhile.')
  if (!Number.isSafeInteger(qty) || qty <= 0 || qty > r.qty) {
    throw AppError.conflict('over_pick', `Only ${r.qty} are held there; ${qty} cannot be passed on.`, { params: { left: r.qty, qty } })
  }
  if (qty === r.qty) {
    await em.update(StockReservation, { id: r.id }, { docType: to.docType, docId: to.docId, docLineId: to.docLineId ?? null })
    return { ...r, docType: to.docType, docId: to.docId, docLineId: to.docLineId ?? null }
  }
  await em.update(StockReservation, { id: r.id }, { qty: r.qty - qty })
  return em.save(em.create(StockReservation, {
    balanceId: r.balanceId, itemId: r.itemId, warehouseId: r.warehouseId, binId: r.binId, lotId: r.lotId, qty,
    docType: to.docType, docId: to.docId, docLineId: to.docLineId ?? null, userId: r.userId,
  }))
}
