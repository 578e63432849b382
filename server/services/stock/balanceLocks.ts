// Locks the balance rows an operation changes, always in one fixed order (item, bin, lot), so two
// operations touching the same rows queue up instead of deadlocking. Missing rows are created first
// (INSERT IGNORE on the unique key), then every row is read with SELECT … FOR UPDATE, one by one and
// without joins, as MariaDB locks exactly those index records.
import type { EntityManager } from 'typeorm'
import { StockBalance } from '../../entities/StockBalance.js'

export interface BalanceKey {
  itemId: number
  binId: number
  lotId: number | null
}

export const balanceKey = (k: BalanceKey) => `${k.itemId}:${k.binId}:${k.lotId ?? 0}`

function compareKeys(a: BalanceKey, b: BalanceKey): number {
  return a.itemId - b.itemId || a.binId - b.binId || (a.lotId ?? 0) - (b.lotId ?? 0)
}

export async function lockBalances(
  em: EntityManager,
  keys: readonly (BalanceKey & { warehouseId: number })[],
  opts: { create: boolean },
): Promise<Map<string, StockBalance>> {
  const unique = new Map<string, BalanceKey & { warehouseId: number }>()
  for (const k of keys) unique.set(balanceKey(k), k)
  const ordered = [...unique.values()].sort(compareKeys)
  if (opts.create && ordered.length) {
    const values = ordered.map(() => '(?, ?, ?, ?, 0, 0)').join(', ')
    // ON DUPLICATE KEY UPDATE locks existing rows exclusively, in this order; INSERT IGNORE locked them
    // shared, and two operations then deadlocked upgrading to FOR UPDATE.
    await em.query(
      `INSERT INTO stock_balances (item_id, warehouse_id, bin_id, lot_id, on_hand, reserved) VALUES ${values} ON DUPLICATE KEY UPDATE on_hand = on_hand`,
      ordered.flatMap((k) => [k.itemId, k.warehouseId, k.binId, k.lotId]),
    )
  }
  const locked = new Map<string, StockBalance>()
  for (const k of ordered) {
    const row = await lockOne(em, k)
    if (row) locked.set(balanceKey(k), row)
  }
  return locked
}

/**
 * By the unique key (item_id, bin_id, lot_key): an exact match locks that one row. Matching lot_id
 * instead could use only the (item, bin) prefix, so FOR UPDATE locked every lot in the bin and the
 * next bin's first row too, and issues and moves in neighbouring bins deadlocked under load.
 */
async function lockOne(em: EntityManager, k: BalanceKey): Promise<StockBalance | null> {
  const rows: { id: number; item_id: number; warehouse_id: number; bin_id: number; lot_id: number | null; on_hand: number; reserved: number }[] =
    await em.query(
      'SELECT id, item_id, warehouse_id, bin_id, lot_id, on_hand, reserved FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_key = ? FOR UPDATE',
      [k.itemId, k.binId, k.lotId ?? 0],
    )
  const r = rows[0]
  if (!r) return null
  return em.create(StockBalance, {
    id: r.id, itemId: r.item_id, warehouseId: r.warehouse_id, binId: r.bin_id, lotId: r.lot_id, onHand: r.on_hand, reserved: r.reserved,
  })
}
