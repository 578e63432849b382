import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Usage from before Lumenyard (past issues and sales per item, warehouse and day), brought in by an
 * import. The reorder statistics read it beside the ledger's issues and picks; it is history, never stock
 * moves, so it changes no balance. Reversing its import deletes its rows.
 */
export class UsageHistory1796420454480 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE usage_history (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      import_id INT NOT NULL,
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      day DATE NOT NULL,
      qty INT NOT NULL,
      KEY ix_usage_history_day (day, item_id, warehouse_id, qty),
      KEY ix_usage_history_line (item_id, warehouse_id, day),
      KEY ix_usage_history_import (import_id),
      CONSTRAINT fk_usage_history_import FOREIGN KEY (import_id) REFERENCES data_imports(id),
      CONSTRAINT fk_usage_history_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_usage_history_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT ck_usage_history_qty CHECK (qty > 0)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE usage_history')
  }
}
