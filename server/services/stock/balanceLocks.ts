// Lock order for every stock change (one order for every row kind, exclusive from the start, so two
// operations on the same rows queue up instead of deadlocking; no path takes a shared lock it later
// upgrades):
//   1. the Idempotency-Key record (inserted first, runIdempotent);
//   2. the document's own rows (pick list, bill of materials, transfer, purchase order);
//   3. bins and lots are only read under share locks and never changed by a stock operation; an issue or an
//      adjustment reads its items and cost rows in that same share-locked read (stockLookups.ts), so a
//      receipt's exclusive cost-row lock (4) waits for it, and nothing holding a balance waits on it;
//   4. item × warehouse cost rows (item_warehouses), sorted by (item, warehouse), exclusive;
//   5. balance rows, sorted by (item, warehouse, bin, lot), exclusive; a receipt's moving-average read
//      locks an item's whole warehouse at its place in that order (index ix_balance_item_wh_bin);
//   6. reservations, then the ledger rows.
// Missing balance rows are created by INSERT … ON DUPLICATE KEY UPDATE, which locks an existing row
// exclusively (INSERT IGNORE locked it shared, and two operations then deadlocked upgrading).
import type { EntityManager } from 'typeorm'
import { sqlOn } from '../../db/onConnection.js'
import { StockBalance } from '../../entities/StockBalance.js'

export interface BalanceKey {
  itemId: number
  binId: number
  lotId: number | null
}

export type WarehouseBalanceKey = BalanceKey & { warehouseId: number }

/** An item's balances in one warehouse, locked whole (the moving-average read of a receipt). */
export interface WarehouseGroup {
  itemId: number
  warehouseId: number
}

export const balanceKey = (k: BalanceKey) => `${k.itemId}:${k.binId}:${k.lotId ?? 0}`
export const groupKey = (g: WarehouseGroup) => `${g.itemId}:${g.warehouseId}`

function compareKeys(a: WarehouseBalanceKey, b: WarehouseBalanceKey): number {
  return a.itemId - b.itemId || a.warehouseId - b.warehouseId || a.binId - b.binId || (a.lotId ?? 0) - (b.lotId ?? 0)
}

interface BalanceRow { id: number; item_id: number; warehouse_id: number; bin_id: number; lot_id: number | null; on_hand: number; reserved: number }
const COLUMNS = 'id, item_id, warehouse_id, bin_id, lot_id, on_hand, reserved'

// The entity filled in directly: em.create looks the entity's metadata up and copies column by column, a
// measurable part of a one-line stock issue for a row whose every field is named here.
function toBalance(r: BalanceRow): StockBalance {
  return Object.assign(new StockBalance(), {
    id: r.id, itemId: r.item_id, warehouseId: r.warehouse_id, binId: r.bin_id, lotId: r.lot_id, onHand: r.on_hand, reserved: r.reserved,
  })
}

export interface LockedBalances {
  /** The rows named by the keys (a key without a row when create is false is absent). */
  rows: Map<string, StockBalance>
  /** On hand of each whole-locked group, before the operation. */
  groupOnHand: Map<string, number>
}

export async function lockBalances(
  em: EntityManager,
  keys: readonly WarehouseBalanceKey[],
  opts: { create: boolean; wholeGroups?: readonly WarehouseGroup[] },
): Promise<LockedBalances> {
  const unique = new Map<string, WarehouseBalanceKey>()
  for (const k of keys) unique.set(balanceKey(k), k)
  const whole = new Set((opts.wholeGroups ?? []).map(groupKey))
  // Groups in (item, warehouse) order, each group's keys in (bin, lot) order.
  const groups = new Map<string, { group: WarehouseGroup; keys: WarehouseBalanceKey[] }>()
  for (const g of opts.wholeGroups ?? []) groups.set(groupKey(g), { group: g, keys: [] })
  for (const k of [...unique.values()].sort(compareKeys)) {
    const gk = groupKey(k)
    if (!groups.has(gk)) groups.set(gk, { group: { itemId: k.itemId, warehouseId: k.warehouseId }, keys: [] })
    groups.get(gk)!.keys.push(k)
  }
  const ordered = [...groups.values()].sort((a, b) => a.group.itemId - b.group.itemId || a.group.warehouseId - b.group.warehouseId)
  const rows = new Map<string, StockBalance>()
  const groupOnHand = new Map<string, number>()
  for (const { group, keys: groupKeys } of ordered) {
    const gk = groupKey(group)
    let pending = groupKeys
    if (whole.has(gk)) {
      // The range scan takes the group's rows (and the gaps between them) in index order.
      const found = await sqlOn<BalanceRow[]>(
        em,
        `SELECT ${COLUMNS} FROM stock_balances FORCE INDEX (ix_balance_item_wh_bin) WHERE item_id = ? AND warehouse_id = ? ORDER BY bin_id, lot_key FOR UPDATE`,
        [group.itemId, group.warehouseId],
      )
      groupOnHand.set(gk, found.reduce((n, r) => n + Number(r.on_hand), 0))
      const byKey = new Map(found.map((r) => [balanceKey({ itemId: r.item_id, binId: r.bin_id, lotId: r.lot_id }), r]))
      for (const k of groupKeys) {
        const r = byKey.get(balanceKey(k))
        if (r) rows.set(balanceKey(k), toBalance(r))
      }
      pending = groupKeys.filter((k) => !rows.has(balanceKey(k)))
    }
    if (opts.create && pending.length) {
      await sqlOn(
        em,
        `INSERT INTO stock_balances (item_id, warehouse_id, bin_id, lot_id, on_hand, reserved) VALUES ${pending.map(() => '(?, ?, ?, ?, 0, 0)').join(', ')} ON DUPLICATE KEY UPDATE on_hand = on_hand`,
        pending.flatMap((k) => [k.itemId, k.warehouseId, k.binId, k.lotId]),
      )
    }
    for (const k of pending) {
      const row = await lockOne(em, k)
      if (row) rows.set(balanceKey(k), row)
    }
  }
  return { rows, groupOnHand }
}

/**
 * By the unique key (item_id, bin_id, lot_key): an exact match locks that one row. Matching lot_id
 * instead could use only the (item, bin) prefix, so FOR UPDATE locked every lot in the bin and the
 * next bin's first row too, and issues and moves in neighbouring bins deadlocked under load.
 */
async function lockOne(em: EntityManager, k: BalanceKey): Promise<StockBalance | null> {
  const found = await sqlOn<BalanceRow[]>(
    em,
    `SELECT ${COLUMNS} FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_key = ? FOR UPDATE`,
    [k.itemId, k.binId, k.lotId ?? 0],
  )
  return found[0] ? toBalance(found[0]) : null
}
