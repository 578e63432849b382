import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Balance rows are locked in one order, (item, warehouse, bin, lot): a receipt's moving-average read locks
 * an item's whole warehouse through this index, so its range scan takes the rows in the same order as the
 * row-by-row locks of every other stock operation (see server/services/stock/balanceLocks.ts).
 * It replaces ix_balance_item_wh, of which it is an extension.
 */
export class BalanceLockOrder1796396073950 implements MigrationInterface {
  name = 'BalanceLockOrder1796396073950'

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE stock_balances ADD KEY ix_balance_item_wh_bin (item_id, warehouse_id, bin_id, lot_key), DROP KEY ix_balance_item_wh')
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE stock_balances ADD KEY ix_balance_item_wh (item_id, warehouse_id), DROP KEY ix_balance_item_wh_bin')
  }
}
