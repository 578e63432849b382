// The one place every stock change goes through. Each operation runs inside the caller's
// transaction (pass its EntityManager); HTTP routes wrap them with runStockRequest (one transaction,
// deadlock retry, Idempotency-Key). Quantities are integers in the item's stock unit.
import type { EntityManager } from 'typeorm'
import type { AdjustmentReason } from '../../../shared/catalog.js'
import { Bin } from '../../entities/Bin.js'
import { Lot } from '../../entities/Lot.js'
import { AppError, problem } from '../../errors.js'
import { currentAverage } from './averageCost.js'
import { currentLotByCode } from './currentRows.js'
import { loadLookups } from './stockLookups.js'
import { applyMoves, type AppliedMoves, type DocRef, type StockActor } from './stockLedger.js'

export type { DocRef, StockActor }

export interface ReceiptLine {
  itemId: number
  binId: number
  /** An existing lot, or a lot code to find or create for the item. Neither: no lot. */
  lotId?: number | null
  lotCode?: string | null
  lotReceivedAt?: string
  vendorId?: number | null
  tintNote?: string | null
  qty: number
  unitCost: string
  docLineId?: number | null
}

/** A bin stock may be put into or taken from: in use, not a transit bin, in the given warehouse if one is named. */
function checkStorageBin(bin: Bin, warehouseId?: number): Bin {
  if (!bin.active) throw AppError.conflict('bin_inactive', `Bin ${bin.code} is not in use.`, { params: { bin: bin.code } })
  // Stock in a transit bin is on its way, never available: it leaves only by receiving the transfer.
  if (bin.kind === 'transit') throw AppError.conflict('bin_in_transit', `Bin ${bin.code} holds stock in transit; receive the transfer to put it away.`, { params: { bin: bin.code } })
  if (warehouseId !== undefined && bin.warehouseId !== warehouseId) {
    throw AppError.badRequest('bin_other_warehouse', `Bin ${bin.code} is in another warehouse.`, { params: { bin: bin.code } })
  }
  return bin
}

async function storageBin(em: EntityManager, binId: number, warehouseId?: number): Promise<Bin> {
  const bin = await em.findOneBy(Bin, { id: binId })
  if (!bin) throw AppError.notFound('bin_not_found', 'That bin was not found.')
  return checkStorageBin(bin, warehouseId)
}

export async function findOrCreateLot(
  em: EntityManager,
  itemId: number,
  code: string,
  extra: { receivedAt?: string; vendorId?: number | null; tintNote?: string | null } = {},
): Promise<Lot> {
  const existing = await em.findOneBy(Lot, { itemId, code })
  if (existing) return existing
  await em.query('INSERT IGNORE INTO lots (item_id, code, received_at, vendor_id, tint_note) VALUES (?, ?, ?, ?, ?)', [
    itemId,
    code,
    extra.receivedAt ?? new Date().toISOString().slice(0, 10),
    extra.vendorId ?? null,
    extra.tintNote ?? null,
  ])
  // A locking read: a lot another request created after this transaction's snapshot is invisible to a
  // plain read under REPEATABLE READ (the insert above was then ignored), which made this a 500.
  const lot = await currentLotByCode(em, itemId, code)
  if (!lot) throw AppError.notFound('item_not_found', `Item ${itemId} was not found.`) // INSERT IGNORE also skips a lot of an unknown item
  return lot
}

/** Receipt into bins: on hand up, moving-average cost blended per item and warehouse. */
export async function receive(
  em: EntityManager,
  actor: StockActor,
  input: { warehouseId: number; lines: ReceiptLine[]; doc?: DocRef; note?: string | null },
): Promise<AppliedMoves> {
  if (!input.lines.length) throw AppError.badRequest('lines_needed', 'A receipt needs at least one line.')
  // Lots are found or made in (item, code) order, so two receipts creating the same lots queue up; the
  // moving average is blended by applyMoves under the cost-row and balance locks.
  const lines = [...input.lines].sort((a, b) => a.itemId - b.itemId || (a.lotCode ?? '').localeCompare(b.lotCode ?? ''))
  for (const line of lines) await storageBin(em, line.binId, input.warehouseId)
  const specs = []
  for (const line of lines) {
    const lotId = line.lotId ?? (line.lotCode ? (await findOrCreateLot(em, line.itemId, line.lotCode, {
      receivedAt: line.lotReceivedAt, vendorId: line.vendorId, tintNote: line.tintNote,
    })).id : null)
    specs.push({
      moveType: 'receipt' as const,
      itemId: line.itemId,
      binId: line.binId,
      lotId,
      qty: line.qty,
      unitCost: line.unitCost,
      doc: input.doc ? { ...input.doc, docLineId: line.docLineId ?? input.doc.docLineId ?? null } : null,
      note: input.note ?? null,
    })
  }
  return applyMoves(em, actor, specs)
}

/**
 * Goods a customer brings back into a bin of the warehouse they left from: on hand up, at the warehouse's
 * current moving-average cost (a return is not a purchase, so the average is left as it is).
 */
export async function receiveReturn(
  em: EntityManager,
  actor: StockActor,
  input: { warehouseId: number; lines: (Omit<ReceiptLine, 'unitCost' | 'vendorId' | 'tintNote'>)[]; doc: DocRef; note?: string | null },
): Promise<AppliedMoves> {
  if (!input.lines.length) throw AppError.badRequest('lines_needed', 'A return needs at least one line.')
  for (const line of input.lines) await storageBin(em, line.binId, input.warehouseId)
  const specs = []
  for (const line of input.lines) {
    const lotId = line.lotId ?? (line.lotCode ? (await findOrCreateLot(em, line.itemId, line.lotCode, { receivedAt: line.lotReceivedAt })).id : null)
    specs.push({
      moveType: 'return' as const, itemId: line.itemId, binId: line.binId, lotId, qty: line.qty,
      unitCost: await currentAverage(em, line.itemId, input.warehouseId),
      doc: { ...input.doc, docLineId: line.docLineId ?? null }, note: input.note ?? null,
    })
  }
  return applyMoves(em, actor, specs)
}

export interface IssueLine {
  itemId: number
  binId: number
  lotId: number | null
  qty: number
  docLineId?: number | null
}

/** Stock out the door (counter sale, job issue). Never takes reserved units. */
export async function issue(
  em: EntityManager,
  actor: StockActor,
  input: { lines: IssueLine[]; doc?: DocRef; reason?: string | null; note?: string | null },
): Promise<AppliedMoves> {
  if (!input.lines.length) throw AppError.badRequest('lines_needed', 'An issue needs at least one line.')
  // One read for every line's item, bin and cost row (stockLookups.ts), then the balances and the ledger.
  const lookups = await loadLookups(em, input.lines, { costs: true })
  const specs = input.lines.map((l) => {
    const bin = checkStorageBin(lookups.bin(l.binId))
    return {
      moveType: 'issue' as const,
      itemId: l.itemId,
      binId: l.binId,
      lotId: l.lotId,
      qty: -l.qty,
      unitCost: lookups.averageCost(l.itemId, bin.warehouseId),
      doc: input.doc ? { ...input.doc, docLineId: l.docLineId ?? null } : null,
      reason: input.reason ?? null,
      note: input.note ?? null,
    }
  })
  return applyMoves(em, actor, specs, lookups)
}

/** A counted, damaged, found or written-off difference in one bin. */
export async function adjust(
  em: EntityManager,
  actor: StockActor,
  input: { itemId: number; binId: number; lotId: number | null; delta: number; reason: AdjustmentReason; note?: string | null; doc?: DocRef },
): Promise<AppliedMoves> {
  const lookups = await loadLookups(em, [input], { costs: true })
  const bin = checkStorageBin(lookups.bin(input.binId))
  // Found units of an item matched by lot must say which lot they are: without one they could never be
  // picked with their run (tint) and would sit apart in a lot of their own.
  if (input.reason === 'found' && input.lotId === null && lookups.item(input.itemId).matchLot) {
    throw AppError.badRequest('lot_required', 'This item is matched by lot: choose the lot the found units belong to.', { fields: { lotId: problem('lot_required') } })
  }
  return applyMoves(em, actor, [
    {
      moveType: input.reason === 'counted' ? 'count' : 'adjustment',
      itemId: input.itemId,
      binId: input.binId,
      lotId: input.lotId,
      qty: input.delta,
      unitCost: lookups.averageCost(input.itemId, bin.warehouseId),
      reason: input.reason,
      note: input.note ?? null,
      doc: input.doc ?? null,
    },
  ], lookups)
}

/** From one bin to another in the same warehouse. */
export async function moveBetweenBins(
  em: EntityManager,
  actor: StockActor,
  input: { itemId: number; lotId: number | null; fromBinId: number; toBinId: number; qty: number; note?: string | null },
): Promise<AppliedMoves> {
  if (input.fromBinId === input.toBinId) throw AppError.badRequest('move_same_bin', 'Choose a different bin to move to.', { fields: { toBinId: problem('move_same_bin') } })
  const common = { moveType: 'bin_move' as const, itemId: input.itemId, lotId: input.lotId, note: input.note ?? null }
  const specs = [
    { ...common, binId: input.fromBinId, qty: -input.qty },
    { ...common, binId: input.toBinId, qty: input.qty },
  ]
  const lookups = await loadLookups(em, specs)
  const from = checkStorageBin(lookups.bin(input.fromBinId))
  checkStorageBin(lookups.bin(input.toBinId), from.warehouseId)
  return applyMoves(em, actor, specs, lookups)
}
