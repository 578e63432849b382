// Locks the balance rows an operation changes, always in one fixed order (item, bin, lot), so two
// operations touching the same rows queue up instead of deadlocking. Missing rows are created first
// (INSERT IGNORE on the unique key), then every row is read with SELECT … FOR UPDATE, one by one and
// without joins, as MariaDB locks exactly those index records.
import { IsNull, type EntityManager } from 'typeorm'
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
    await em.query(
      `INSERT IGNORE INTO stock_balances (item_id, warehouse_id, bin_id, lot_id, on_hand, reserved) VALUES ${values}`,
      ordered.flatMap((k) => [k.itemId, k.warehouseId, k.binId, k.lotId]),
    )
  }
  const locked = new Map<string, StockBalance>()
  for (const k of ordered) {
    const row = await em.findOne(StockBalance, {
      where: { itemId: k.itemId, binId: k.binId, lotId: k.lotId ?? IsNull() },
      lock: { mode: 'pessimistic_write' },
    })
    if (row) locked.set(balanceKey(k), row)
  }
  return locked
}
