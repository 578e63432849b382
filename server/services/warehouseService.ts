// Warehouses and their bins: lists for everyone, changes for admins (audited). Storage bin codes
// must fit the warehouse's bin pattern, which the pick walk reads aisle, bay and level from.
import type { DataSource, EntityManager } from 'typeorm'
import { In } from 'typeorm'
import {
  binCodeFitsPattern, binRangeCodes, type BinInput, type BinPatch, type BinRangeInput, type BinRangeResult, type BinRow,
  type WarehouseDetail, type WarehouseInput, type WarehousePatch, type WarehouseRow,
} from '../../shared/schemas/warehouses.js'
import { inTransaction, isDuplicateKey, isReferenced } from '../db/transaction.js'
import { Bin } from '../entities/Bin.js'
import { Warehouse } from '../entities/Warehouse.js'
import { AppError, problem } from '../errors.js'
import { audit, type AuditActor } from './auditService.js'
import { lockAtVersion } from './editVersion.js'

function toWarehouseRow(w: Warehouse, bins: number): WarehouseRow {
  return { id: w.id, code: w.code, name: w.name, address: w.address, binPattern: w.binPattern, aisleOrder: w.aisleOrder, walkDirection: w.walkDirection, active: w.active, bins, version: w.version }
}

export async function listWarehouses(ds: DataSource): Promise<WarehouseRow[]> {
  const warehouses = await ds.getRepository(Warehouse).find({ order: { code: 'ASC' } })
  const counts: { warehouse_id: number; n: string }[] = await ds.query('SELECT warehouse_id, COUNT(*) AS n FROM bins GROUP BY warehouse_id')
  return warehouses.map((w) => toWarehouseRow(w, Number(counts.find((c) => Number(c.warehouse_id) === w.id)?.n ?? 0)))
}

async function findWarehouse(em: EntityManager, id: number, lock = false): Promise<Warehouse> {
  const w = await em.findOne(Warehouse, { where: { id }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) })
  if (!w) throw AppError.notFound('warehouse_not_found', 'That warehouse was not found.')
  return w
}

export async function listBins(em: EntityManager, warehouseId: number, ids?: number[]): Promise<BinRow[]> {
  const rows = await em.query(
    `SELECT b.id, b.warehouse_id, b.code, b.kind, b.active,
            COUNT(DISTINCT CASE WHEN sb.on_hand > 0 THEN sb.item_id END) AS items, COALESCE(SUM(sb.on_hand), 0) AS on_hand
     FROM bins b LEFT JOIN stock_balances sb ON sb.bin_id = b.id
     WHERE b.warehouse_id = ? ${ids?.length ? 'AND b.id IN (?)' : ''}
     GROUP BY b.id ORDER BY b.code`,
    ids?.length ? [warehouseId, ids] : [warehouseId],
  )
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id), warehouseId: Number(r.warehouse_id), code: String(r.code), kind: String(r.kind), active: Boolean(r.active),
    items: Number(r.items), onHand: Number(r.on_hand),
  }))
}

export async function warehouseDetail(ds: DataSource, id: number): Promise<WarehouseDetail> {
  const w = await findWarehouse(ds.manager, id)
  const bins = await listBins(ds.manager, id)
  return { warehouse: toWarehouseRow(w, bins.length), bins }
}

const duplicateWarehouse = (err: unknown) =>
  isDuplicateKey(err) ? AppError.conflict('warehouse_code_taken', 'Another warehouse has that code.', { fields: { code: problem('warehouse_code_taken') } }) : null

export async function createWarehouse(ds: DataSource, actor: AuditActor, input: WarehouseInput): Promise<WarehouseRow> {
  try {
    return await inTransaction(ds, async (em) => {
      const w = await em.save(em.create(Warehouse, { ...input, address: input.address ?? null, active: input.active ?? true }))
      await audit(em, actor, 'warehouse.create', 'warehouse', w.id, { code: w.code })
      return toWarehouseRow(w, 0)
    })
  } catch (err) {
    throw duplicateWarehouse(err) ?? err
  }
}

/** A new bin pattern must still fit every storage bin the warehouse has. */
async function checkPatternFits(em: EntityManager, warehouseId: number, pattern: string): Promise<void> {
  const bins = await em.findBy(Bin, { warehouseId, kind: 'storage' })
  const misfits = bins.filter((b) => !binCodeFitsPattern(b.code, pattern)).map((b) => b.code)
  if (misfits.length) {
    const params = { bins: misfits.slice(0, 5), more: Math.max(0, misfits.length - 5) }
    throw AppError.badRequest('bin_pattern_misfits', 'Some storage bins would not fit the new pattern.', { params, fields: { binPattern: problem('bin_pattern_misfits', params) } })
  }
}

export async function updateWarehouse(ds: DataSource, actor: AuditActor, id: number, { version, ...patch }: WarehousePatch): Promise<WarehouseRow> {
  try {
    return await inTransaction(ds, async (em) => {
      const w = await lockAtVersion(em, Warehouse, id, version, {
        notFound: () => AppError.notFound('warehouse_not_found', 'That warehouse was not found.'),
        name: (row) => row.code,
      })
      if (patch.binPattern !== undefined && patch.binPattern !== w.binPattern) await checkPatternFits(em, id, patch.binPattern)
      const changes = Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined))
      if (Object.keys(changes).length) await em.update(Warehouse, { id }, changes)
      await audit(em, actor, 'warehouse.update', 'warehouse', id, { code: w.code, changes })
      const saved = await findWarehouse(em, id)
      return toWarehouseRow(saved, await em.countBy(Bin, { warehouseId: id }))
    })
  } catch (err) {
    throw duplicateWarehouse(err) ?? err
  }
}

function checkBinCode(w: Warehouse, code: string, kind: string): void {
  if (kind === 'storage' && !binCodeFitsPattern(code, w.binPattern)) {
    const params = { code, warehouse: w.code }
    throw AppError.badRequest('bin_code_misfit', `Bin ${code} does not fit the bin pattern of ${w.code}.`, { params, fields: { code: problem('bin_code_misfit', params) } })
  }
}

const duplicateBin = (err: unknown) =>
  isDuplicateKey(err) ? AppError.conflict('bin_code_taken', 'That warehouse already has a bin with this code.', { fields: { code: problem('bin_code_taken') } }) : null

export async function createBin(ds: DataSource, actor: AuditActor, warehouseId: number, input: BinInput): Promise<BinRow> {
  try {
    return await inTransaction(ds, async (em) => {
      const w = await findWarehouse(em, warehouseId)
      checkBinCode(w, input.code, input.kind)
      const bin = await em.save(em.create(Bin, { warehouseId, code: input.code, kind: input.kind, active: input.active ?? true }))
      await audit(em, actor, 'bin.create', 'bin', bin.id, { warehouse: w.code, code: bin.code })
      return (await listBins(em, warehouseId, [bin.id]))[0]
    })
  } catch (err) {
    throw duplicateBin(err) ?? err
  }
}

/** A bin of the warehouse, locked for a change; the transit bin belongs to transfers and is refused. */
async function lockChangeableBin(em: EntityManager, warehouseId: number, binId: number): Promise<Bin> {
  const bin = await em.findOne(Bin, { where: { id: binId, warehouseId }, lock: { mode: 'pessimistic_write' } })
  if (!bin) throw AppError.notFound('bin_not_found', 'That bin was not found.')
  if (bin.kind === 'transit') throw AppError.conflict('transit_bin_fixed', 'The transit bin belongs to transfers and cannot be changed.')
  return bin
}

export async function updateBin(ds: DataSource, actor: AuditActor, warehouseId: number, binId: number, patch: BinPatch): Promise<BinRow> {
  try {
    return await inTransaction(ds, async (em) => {
      const w = await findWarehouse(em, warehouseId)
      const bin = await lockChangeableBin(em, warehouseId, binId)
      const next = { code: patch.code ?? bin.code, kind: patch.kind ?? bin.kind, active: patch.active ?? bin.active }
      checkBinCode(w, next.code, next.kind)
      if (!next.active && bin.active) await refuseIfStocked(em, bin)
      await em.update(Bin, { id: binId }, next)
      await audit(em, actor, 'bin.update', 'bin', binId, { warehouse: w.code, from: { code: bin.code, kind: bin.kind, active: bin.active }, to: next })
      return (await listBins(em, warehouseId, [binId]))[0]
    })
  } catch (err) {
    throw duplicateBin(err) ?? err
  }
}

/**
 * Deletes a bin made by mistake. Only a bin that never held or moved anything goes; one with any history is
 * kept for its stock movements and can only be taken out of use.
 */
export async function deleteBin(ds: DataSource, actor: AuditActor, warehouseId: number, binId: number): Promise<{ deleted: number }> {
  const inUse = () => AppError.conflict('bin_used', 'This bin has stock movements or other history, so it stays on record; take it out of use instead.')
  try {
    return await inTransaction(ds, async (em) => {
      const w = await findWarehouse(em, warehouseId)
      const bin = await lockChangeableBin(em, warehouseId, binId)
      // Tables that name a bin without a foreign key; the rest (balances, pick lines, receipts, counts) refuse the delete themselves.
      const [used] = await em.query(
        `SELECT EXISTS (SELECT 1 FROM stock_moves WHERE bin_id = ?) OR EXISTS (SELECT 1 FROM stock_reservations WHERE bin_id = ?)
             OR EXISTS (SELECT 1 FROM transfer_lines WHERE from_bin_id = ?) OR EXISTS (SELECT 1 FROM pick_transfer_proposals WHERE from_bin_id = ?) AS used`,
        [binId, binId, binId, binId],
      )
      if (Number(used.used)) throw inUse()
      await em.delete(Bin, { id: binId })
      await audit(em, actor, 'bin.delete', 'bin', binId, { warehouse: w.code, code: bin.code, kind: bin.kind })
      return { deleted: binId }
    })
  } catch (err) {
    throw isReferenced(err) ? inUse() : err
  }
}

async function refuseIfStocked(em: EntityManager, bin: Bin): Promise<void> {
  const [row] = await em.query('SELECT COALESCE(SUM(on_hand), 0) AS n FROM stock_balances WHERE bin_id = ?', [bin.id])
  if (Number(row.n) > 0) throw AppError.conflict('bin_stocked', `Bin ${bin.code} still holds ${Number(row.n)} units; move them before taking the bin out of use.`, { params: { bin: bin.code, units: Number(row.n) } })
}

/** Creates every bin of a range that does not exist yet; existing codes are reported, not changed. */
export async function createBinRange(ds: DataSource, actor: AuditActor, warehouseId: number, range: BinRangeInput): Promise<BinRangeResult> {
  return inTransaction(ds, async (em) => {
    const w = await findWarehouse(em, warehouseId, true)
    const codes = binRangeCodes(range)
    const misfit = codes.find((c) => !binCodeFitsPattern(c, w.binPattern))
    if (misfit) {
      const params = { code: misfit, warehouse: w.code }
      throw AppError.badRequest('bin_code_misfit', `Bin ${misfit} would not fit the bin pattern of ${w.code}.`, { params, fields: { bayDigits: problem('bin_code_misfit', params) } })
    }
    const existing = new Set((await em.findBy(Bin, { warehouseId, code: In(codes) })).map((b) => b.code))
    const fresh = codes.filter((c) => !existing.has(c))
    for (let i = 0; i < fresh.length; i += 500) {
      await em.insert(Bin, fresh.slice(i, i + 500).map((code) => ({ warehouseId, code, kind: 'storage' as const, active: true })))
    }
    await audit(em, actor, 'bin.create-range', 'warehouse', warehouseId, { warehouse: w.code, created: fresh.length, first: fresh[0] ?? null, last: fresh.at(-1) ?? null })
    return { created: fresh.length, skipped: [...existing].sort() }
  })
}
