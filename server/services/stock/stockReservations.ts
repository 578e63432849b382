// Reservations hold stock for a document line (a pick list line): reserved up, available down.
// A balance's reserved always equals the sum of its reservation rows.
import { In, type EntityManager } from 'typeorm'
import { StockBalance } from '../../entities/StockBalance.js'
import { StockReservation } from '../../entities/StockReservation.js'
import { AppError } from '../../errors.js'
import { currentAverage } from './averageCost.js'
import { balanceKey, lockBalances } from './balanceLocks.js'
import { notEnoughAvailable } from './stockErrors.js'
import { applyMoves, type AppliedMoves, type DocRef, type StockActor } from './stockLedger.js'
import { loadLookups } from './stockLookups.js'

export interface ReserveLine {
  itemId: number
  binId: number
  lotId: number | null
  qty: number
  docLineId?: number | null
}

export async function reserve(
  em: EntityManager,
  actor: StockActor,
  input: { doc: Omit<DocRef, 'docLineId'>; lines: ReserveLine[] },
): Promise<StockReservation[]> {
  const lookups = await loadLookups(em, input.lines)
  const keys = input.lines.map((l) => ({ ...l, warehouseId: lookups.bin(l.binId).warehouseId }))
  const balances = (await lockBalances(em, keys, { create: false })).rows
  const created: StockReservation[] = []
  for (const l of input.lines) {
    if (!Number.isSafeInteger(l.qty) || l.qty <= 0) throw AppError.badRequest('qty_not_positive', 'Reserve a whole number above zero.')
    const bal = balances.get(balanceKey(l))
    const onHand = bal?.onHand ?? 0
    const reserved = bal?.reserved ?? 0
    if (!bal || onHand - reserved < l.qty) throw notEnoughAvailable(lookups.describe(l), onHand, reserved, l.qty)
    bal.reserved += l.qty
    created.push(em.create(StockReservation, {
      balanceId: bal.id, itemId: l.itemId, warehouseId: bal.warehouseId, binId: l.binId, lotId: l.lotId, qty: l.qty,
      docType: input.doc.docType, docId: input.doc.docId, docLineId: l.docLineId ?? null, userId: actor.userId,
    }))
  }
  for (const bal of balances.values()) await em.update(StockBalance, { id: bal.id }, { reserved: bal.reserved })
  return em.save(created)
}

async function lockReservations(em: EntityManager, where: { docType: string; docId: number; docLineId?: number }) {
  const rows = await em.find(StockReservation, { where, order: { id: 'ASC' } })
  if (!rows.length) return { rows, balances: new Map<string, StockBalance>() }
  const balances = (await lockBalances(em, rows, { create: false })).rows
  // Re-read under the balance locks: a concurrent release or pick may have changed them.
  const locked = await em.find(StockReservation, { where: { id: In(rows.map((r) => r.id)) }, lock: { mode: 'pessimistic_write' } })
  return { rows: locked, balances }
}

/**
 * Locks every balance a document holds stock in, in one sorted pass, before it is issued line by line:
 * issuing each line with its own lock would take them out of the one balance order.
 */
export async function lockDocumentBalances(em: EntityManager, where: { docType: string; docId: number }): Promise<void> {
  await lockReservations(em, where)
}

/** Releases what a document (or one of its lines) holds: cancelling a pick list. */
export async function releaseReservations(
  em: EntityManager,
  _actor: StockActor,
  where: { docType: string; docId: number; docLineId?: number },
): Promise<number> {
  const { rows, balances } = await lockReservations(em, where)
  let released = 0
  for (const r of rows) {
    const bal = balances.get(balanceKey(r))!
    bal.reserved -= r.qty
    released += r.qty
  }
  for (const bal of balances.values()) await em.update(StockBalance, { id: bal.id }, { reserved: bal.reserved })
  if (rows.length) await em.delete(StockReservation, { id: In(rows.map((r) => r.id)) })
  return released
}

/**
 * Picks reserved stock: issues qty from the reservation's bin and lot, reserved and on hand both
 * down. A pick beyond what the reservation holds is refused.
 */
export async function pickReserved(
  em: EntityManager,
  actor: StockActor,
  input: { reservationId: number; qty: number; doc: DocRef; note?: string | null },
): Promise<AppliedMoves> {
  const found = await em.findOneBy(StockReservation, { id: input.reservationId })
  if (!found) throw AppError.notFound('reservation_not_found', 'That reservation was not found.')
  const { rows } = await lockReservations(em, { docType: found.docType, docId: found.docId, docLineId: found.docLineId ?? undefined })
  const r = rows.find((row) => row.id === found.id)
  if (!r) throw AppError.conflict('reservation_released', 'That reservation was released meanwhile.')
  if (!Number.isSafeInteger(input.qty) || input.qty <= 0) throw AppError.badRequest('qty_not_positive', 'Pick a whole number above zero.')
  if (input.qty > r.qty) throw AppError.conflict('over_pick', `Only ${r.qty} are held for this line; ${input.qty} cannot be picked.`, { params: { left: r.qty, qty: input.qty } })
  const unitCost = await currentAverage(em, r.itemId, r.warehouseId)
  const applied = await applyMoves(em, actor, [{
    moveType: 'pick', itemId: r.itemId, binId: r.binId, lotId: r.lotId, qty: -input.qty, fromReserved: input.qty,
    unitCost, doc: input.doc, note: input.note ?? null,
  }])
  if (input.qty === r.qty) await em.delete(StockReservation, { id: r.id })
  else await em.update(StockReservation, { id: r.id }, { qty: r.qty - input.qty })
  return applied
}
