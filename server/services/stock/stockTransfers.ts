// Transfers between warehouses: shipped out of source bins into the destination's transit bin
// (visible there as in transit, never available to pick), then put away into storage bins.
import { In, type EntityManager } from 'typeorm'
import { Bin } from '../../entities/Bin.js'
import { Transfer, TransferLine } from '../../entities/Transfer.js'
import { Warehouse } from '../../entities/Warehouse.js'
import { AppError, problem } from '../../errors.js'
import { audit } from '../auditService.js'
import { currentAverage } from './averageCost.js'
import { currentBinByCode } from './currentRows.js'
import { applyMoves, type StockActor } from './stockLedger.js'

export const TRANSIT_BIN_CODE = 'IN-TRANSIT'

export async function transitBin(em: EntityManager, warehouseId: number): Promise<Bin> {
  await em.query(`INSERT IGNORE INTO bins (warehouse_id, code, kind, active) VALUES (?, ?, 'transit', 1)`, [warehouseId, TRANSIT_BIN_CODE])
  // A locking read sees the bin even when a concurrent first transfer created it after this
  // transaction's snapshot (a plain read did not: 500 on the first transfers into a warehouse).
  const bin = await currentBinByCode(em, warehouseId, TRANSIT_BIN_CODE)
  if (!bin) throw AppError.notFound('warehouse_not_found', 'That warehouse was not found.')
  return bin
}

export interface ShipLine {
  itemId: number
  lotId: number | null
  fromBinId: number
  qty: number
}

export async function shipTransfer(
  em: EntityManager,
  actor: StockActor,
  input: { fromWarehouseId: number; toWarehouseId: number; lines: ShipLine[]; note?: string | null },
): Promise<{ transfer: Transfer; lines: TransferLine[] }> {
  if (input.fromWarehouseId === input.toWarehouseId) {
    throw AppError.badRequest('transfer_same_warehouse', 'A transfer goes to another warehouse.', { fields: { toWarehouseId: problem('transfer_same_warehouse') } })
  }
  if (!input.lines.length) throw AppError.badRequest('lines_needed', 'A transfer needs at least one line.')
  const warehouses = await em.findBy(Warehouse, { id: In([input.fromWarehouseId, input.toWarehouseId]) })
  if (warehouses.length !== 2) throw AppError.notFound('warehouse_not_found', 'That warehouse was not found.')
  const bins = await em.findBy(Bin, { id: In(input.lines.map((l) => l.fromBinId)) })
  for (const l of input.lines) {
    const bin = bins.find((b) => b.id === l.fromBinId)
    if (!bin || bin.warehouseId !== input.fromWarehouseId) throw AppError.badRequest('transfer_bin_not_shipping', `Bin ${bin?.code ?? l.fromBinId} is not in the shipping warehouse.`, { params: { bin: bin?.code ?? String(l.fromBinId) } })
    if (bin.kind === 'transit') throw AppError.conflict('bin_in_transit', `Bin ${bin.code} holds stock in transit; receive that transfer first.`, { params: { bin: bin.code } })
  }
  const transit = await transitBin(em, input.toWarehouseId)
  const transfer = await em.save(em.create(Transfer, {
    fromWarehouseId: input.fromWarehouseId, toWarehouseId: input.toWarehouseId, status: 'in_transit', note: input.note ?? null, shippedBy: actor.userId,
  }))
  const lines = await em.save(input.lines.map((l) => em.create(TransferLine, { transferId: transfer.id, itemId: l.itemId, lotId: l.lotId, fromBinId: l.fromBinId, qty: l.qty, receivedQty: 0 })))
  const specs = []
  // The shipped cost blends into the receiving warehouse's average in applyMoves (transfer_in is costed).
  for (const line of lines) {
    const unitCost = await currentAverage(em, line.itemId, input.fromWarehouseId)
    const doc = { docType: 'transfer', docId: transfer.id, docLineId: line.id }
    specs.push(
      { moveType: 'transfer_out' as const, itemId: line.itemId, lotId: line.lotId, binId: line.fromBinId, qty: -line.qty, unitCost, doc },
      { moveType: 'transfer_in' as const, itemId: line.itemId, lotId: line.lotId, binId: transit.id, qty: line.qty, unitCost, doc },
    )
  }
  await applyMoves(em, actor, specs)
  await audit(em, actor, 'transfer.ship', 'transfer', transfer.id, { lines: lines.length })
  return { transfer, lines }
}

/** Puts away what arrived: from the transit bin into storage bins, line by line, partly if need be. */
export async function receiveTransfer(
  em: EntityManager,
  actor: StockActor,
  input: { transferId: number; lines: { lineId: number; toBinId: number; qty: number }[] },
): Promise<Transfer> {
  const transfer = await em.findOne(Transfer, { where: { id: input.transferId }, lock: { mode: 'pessimistic_write' } })
  if (!transfer) throw AppError.notFound('transfer_not_found', 'That transfer was not found.')
  if (transfer.status !== 'in_transit') throw AppError.conflict('transfer_received', 'This transfer was already received.')
  const lines = await em.findBy(TransferLine, { transferId: transfer.id })
  const transit = await transitBin(em, transfer.toWarehouseId)
  const specs = []
  for (const put of input.lines) {
    const line = lines.find((l) => l.id === put.lineId)
    if (!line) throw AppError.badRequest('transfer_line_not_found', `Line ${put.lineId} is not on this transfer.`, { params: { line: put.lineId } })
    if (line.receivedQty + put.qty > line.qty) {
      throw AppError.conflict('transfer_receive_too_many', `Only ${line.qty - line.receivedQty} left to receive on line ${line.id}.`, { params: { left: line.qty - line.receivedQty, line: line.id } })
    }
    const bin = await em.findOneBy(Bin, { id: put.toBinId })
    if (!bin || bin.warehouseId !== transfer.toWarehouseId || bin.kind === 'transit') throw AppError.badRequest('transfer_bin_not_receiving', `Bin ${bin?.code ?? put.toBinId} is not a storage bin of the receiving warehouse.`, { params: { bin: bin?.code ?? String(put.toBinId) } })
    line.receivedQty += put.qty
    const doc = { docType: 'transfer', docId: transfer.id, docLineId: line.id }
    const common = { moveType: 'bin_move' as const, itemId: line.itemId, lotId: line.lotId, doc }
    specs.push({ ...common, binId: transit.id, qty: -put.qty }, { ...common, binId: put.toBinId, qty: put.qty })
  }
  await applyMoves(em, actor, specs)
  await em.save(lines)
  if (lines.every((l) => l.receivedQty === l.qty)) {
    transfer.status = 'received'
    transfer.receivedAt = new Date()
    transfer.receivedBy = actor.userId
    await em.save(transfer)
  }
  await audit(em, actor, 'transfer.receive', 'transfer', transfer.id, { lines: input.lines.length, complete: transfer.status === 'received' })
  return transfer
}
