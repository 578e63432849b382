import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Reorder policies (layered: global → family → ABC class → item in a warehouse; a NULL field inherits) and
 * the guard that keeps one open reorder suggestion per item and warehouse.
 */
export class ReorderPolicies1764740000000 implements MigrationInterface {
  name = 'ReorderPolicies1764740000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE reorder_policies (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      scope VARCHAR(16) NOT NULL,
      scope_key VARCHAR(40) NOT NULL,
      family VARCHAR(20) NULL,
      abc_class CHAR(1) NULL,
      item_id INT NULL,
      warehouse_id INT NULL,
      service_level DECIMAL(5,4) NULL,
      review_period_days INT NULL,
      cost_per_order DECIMAL(12,2) NULL,
      holding_rate DECIMAL(5,4) NULL,
      method VARCHAR(10) NULL,
      soon_days INT NULL,
      overstock_margin_days INT NULL,
      dead_stock_days INT NULL,
      usage_window_days INT NULL,
      abc_cutoff_a DECIMAL(5,4) NULL,
      abc_cutoff_b DECIMAL(5,4) NULL,
      override_reorder_point INT NULL,
      override_order_qty INT NULL,
      override_reason VARCHAR(200) NULL,
      note VARCHAR(200) NULL,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_reorder_policies_scope (scope, scope_key),
      KEY ix_reorder_policies_item (item_id, warehouse_id),
      CONSTRAINT fk_reorder_policies_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_reorder_policies_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_reorder_policies_user FOREIGN KEY (updated_by) REFERENCES users(id),
      CONSTRAINT ck_reorder_policies_scope CHECK (scope IN ('global', 'family', 'abc', 'item_warehouse')),
      CONSTRAINT ck_reorder_policies_target CHECK (
        (scope = 'global' AND family IS NULL AND abc_class IS NULL AND item_id IS NULL AND warehouse_id IS NULL)
        OR (scope = 'family' AND family IS NOT NULL AND abc_class IS NULL AND item_id IS NULL)
        OR (scope = 'abc' AND abc_class IN ('A', 'B', 'C') AND family IS NULL AND item_id IS NULL)
        OR (scope = 'item_warehouse' AND item_id IS NOT NULL AND warehouse_id IS NOT NULL AND family IS NULL AND abc_class IS NULL)),
      CONSTRAINT ck_reorder_policies_override CHECK (
        (override_reorder_point IS NULL AND override_order_qty IS NULL)
        OR (scope = 'item_warehouse' AND override_reason IS NOT NULL AND TRIM(override_reason) <> '')),
      CONSTRAINT ck_reorder_policies_values CHECK (
        (service_level IS NULL OR (service_level >= 0.5 AND service_level <= 0.999))
        AND (holding_rate IS NULL OR holding_rate >= 0)
        AND (cost_per_order IS NULL OR cost_per_order >= 0)
        AND (method IS NULL OR method IN ('eoq', 'orderUpTo'))
        AND (override_reorder_point IS NULL OR override_reorder_point >= 0)
        AND (override_order_qty IS NULL OR override_order_qty > 0))
    ) ${TABLE}`)
    // At most one open (accepted, not yet on a PO) reorder suggestion per item and warehouse: accepting twice,
    // even from two tabs at once, cannot order twice. Backorder suggestions are not limited.
    await q.query(`ALTER TABLE purchase_suggestions
      ADD COLUMN open_reorder_key VARCHAR(24) AS
        (IF(status = 'accepted' AND source = 'reorder', CONCAT(item_id, ':', warehouse_id), NULL)) PERSISTENT,
      ADD UNIQUE KEY uq_suggestions_open_reorder (open_reorder_key)`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE purchase_suggestions DROP KEY uq_suggestions_open_reorder, DROP COLUMN open_reorder_key')
    await q.query('DROP TABLE reorder_policies')
  }
}
