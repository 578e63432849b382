// Current (locking) reads of bins and lots. Under REPEATABLE READ a plain read sees the transaction's
// snapshot, so a transit bin or lot that a concurrent request created meanwhile stays invisible; a
// shared-lock read sees the latest committed row. Written in SQL because TypeORM's 'mysql' driver
// emits FOR SHARE for pessimistic_read on servers >= 8.0.0 by version number, which MariaDB rejects.
import type { EntityManager } from 'typeorm'
import { Bin } from '../../entities/Bin.js'
import { Lot } from '../../entities/Lot.js'

interface BinRow { id: number; warehouse_id: number; code: string; kind: Bin['kind']; active: number }
interface LotRow { id: number; item_id: number; code: string; received_at: string; vendor_id: number | null; tint_note: string | null; created_at: Date }

const BIN_COLUMNS = 'id, warehouse_id, code, kind, active'
const LOT_COLUMNS = "id, item_id, code, DATE_FORMAT(received_at, '%Y-%m-%d') AS received_at, vendor_id, tint_note, created_at"

function toBin(em: EntityManager, r: BinRow): Bin {
  return em.create(Bin, { id: r.id, warehouseId: r.warehouse_id, code: r.code, kind: r.kind, active: Boolean(r.active) })
}

function toLot(em: EntityManager, r: LotRow): Lot {
  return em.create(Lot, {
    id: r.id, itemId: r.item_id, code: r.code, receivedAt: r.received_at, vendorId: r.vendor_id, tintNote: r.tint_note, createdAt: r.created_at,
  })
}

export async function currentBinByCode(em: EntityManager, warehouseId: number, code: string): Promise<Bin | null> {
  const rows: BinRow[] = await em.query(`SELECT ${BIN_COLUMNS} FROM bins WHERE warehouse_id = ? AND code = ? LOCK IN SHARE MODE`, [warehouseId, code])
  return rows.length ? toBin(em, rows[0]) : null
}

export async function currentLotsById(em: EntityManager, ids: readonly number[]): Promise<Lot[]> {
  if (!ids.length) return []
  const rows: LotRow[] = await em.query(`SELECT ${LOT_COLUMNS} FROM lots WHERE id IN (?) LOCK IN SHARE MODE`, [ids])
  return rows.map((r) => toLot(em, r))
}

export async function currentLotByCode(em: EntityManager, itemId: number, code: string): Promise<Lot | null> {
  const rows: LotRow[] = await em.query(`SELECT ${LOT_COLUMNS} FROM lots WHERE item_id = ? AND code = ? LOCK IN SHARE MODE`, [itemId, code])
  return rows.length ? toLot(em, rows[0]) : null
}
