import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Cycle counts: a count of one warehouse (all of it, an aisle, a list of bins, the items due by ABC class,
 * or the bins a short pick found wrong), the bins to visit with the ledger point each visit started at, and
 * one line per bin × item × lot × attempt with its snapshot, blind count, reconciled expectation and review.
 * Also the handheld outbox reports (confirmations waiting or refused on a device).
 */
export class CycleCounts1796396073322 implements MigrationInterface {
  name = 'CycleCounts1796396073322'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE cycle_counts (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      warehouse_id INT NOT NULL,
      scope VARCHAR(12) NOT NULL,
      scope_detail VARCHAR(400) NULL,
      items_only TINYINT(1) NOT NULL DEFAULT 0,
      status VARCHAR(12) NOT NULL DEFAULT 'open',
      note VARCHAR(200) NULL,
      created_by INT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      closed_at DATETIME(3) NULL,
      cancelled_by INT NULL,
      cancelled_at DATETIME(3) NULL,
      cancel_reason VARCHAR(200) NULL,
      updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      open_short_pick_key INT AS (IF(status = 'open' AND scope = 'short_pick', warehouse_id, NULL)) PERSISTENT,
      UNIQUE KEY uq_counts_open_short_pick (open_short_pick_key),
      KEY ix_counts_wh_status (warehouse_id, status),
      KEY ix_counts_status (status, created_at),
      CONSTRAINT fk_counts_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT ck_counts CHECK (scope IN ('warehouse', 'aisle', 'bins', 'abc_due', 'short_pick') AND status IN ('open', 'closed', 'cancelled'))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE count_items (
      count_id INT NOT NULL,
      item_id INT NOT NULL,
      PRIMARY KEY (count_id, item_id),
      CONSTRAINT fk_count_items_count FOREIGN KEY (count_id) REFERENCES cycle_counts(id),
      CONSTRAINT fk_count_items_item FOREIGN KEY (item_id) REFERENCES items(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE count_bins (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      count_id INT NOT NULL,
      bin_id INT NOT NULL,
      status VARCHAR(10) NOT NULL DEFAULT 'waiting',
      visits INT NOT NULL DEFAULT 0,
      snapshot_move_id BIGINT NULL,
      started_by INT NULL,
      started_at DATETIME(3) NULL,
      finished_by INT NULL,
      finished_at DATETIME(3) NULL,
      UNIQUE KEY uq_count_bins (count_id, bin_id),
      KEY ix_count_bins_bin (bin_id),
      CONSTRAINT fk_count_bins_count FOREIGN KEY (count_id) REFERENCES cycle_counts(id),
      CONSTRAINT fk_count_bins_bin FOREIGN KEY (bin_id) REFERENCES bins(id),
      CONSTRAINT ck_count_bins CHECK (status IN ('waiting', 'counting', 'done') AND visits >= 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE count_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      count_id INT NOT NULL,
      count_bin_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      bin_id INT NOT NULL,
      item_id INT NOT NULL,
      lot_id INT NULL,
      lot_key INT AS (IFNULL(lot_id, 0)) PERSISTENT,
      attempt INT NOT NULL DEFAULT 1,
      recount_of INT NULL,
      source VARCHAR(12) NOT NULL DEFAULT 'planned',
      status VARCHAR(10) NOT NULL DEFAULT 'waiting',
      snapshot_qty INT NULL,
      snapshot_move_id BIGINT NULL,
      snapshot_at DATETIME(3) NULL,
      counted_qty INT NULL,
      moves_since INT NULL,
      expected_qty INT NULL,
      variance INT NULL,
      unit_cost DECIMAL(12,4) NULL,
      counted_by INT NULL,
      counted_at DATETIME(3) NULL,
      reviewed_by INT NULL,
      reviewed_at DATETIME(3) NULL,
      review_note VARCHAR(200) NULL,
      move_id BIGINT NULL,
      pick_list_id INT NULL,
      pick_list_line_id INT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE KEY uq_count_lines (count_id, bin_id, item_id, lot_key, attempt),
      KEY ix_count_lines_count (count_id, status),
      KEY ix_count_lines_bin_item (bin_id, item_id),
      KEY ix_count_lines_item (item_id, warehouse_id),
      KEY ix_count_lines_wh_counted (warehouse_id, counted_at),
      CONSTRAINT fk_count_lines_count FOREIGN KEY (count_id) REFERENCES cycle_counts(id),
      CONSTRAINT fk_count_lines_count_bin FOREIGN KEY (count_bin_id) REFERENCES count_bins(id),
      CONSTRAINT fk_count_lines_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_count_lines_bin FOREIGN KEY (bin_id) REFERENCES bins(id),
      CONSTRAINT fk_count_lines_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_count_lines_lot FOREIGN KEY (lot_id) REFERENCES lots(id),
      CONSTRAINT fk_count_lines_recount FOREIGN KEY (recount_of) REFERENCES count_lines(id),
      CONSTRAINT fk_count_lines_pick_list FOREIGN KEY (pick_list_id) REFERENCES pick_lists(id),
      CONSTRAINT fk_count_lines_pick_line FOREIGN KEY (pick_list_line_id) REFERENCES pick_list_lines(id),
      CONSTRAINT ck_count_lines CHECK (
        attempt >= 1 AND (counted_qty IS NULL OR counted_qty >= 0) AND (snapshot_qty IS NULL OR snapshot_qty >= 0)
        AND source IN ('planned', 'found', 'short_pick')
        AND status IN ('waiting', 'counted', 'matched', 'approved', 'recounted', 'cancelled'))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE device_outbox_reports (
      device_id VARCHAR(64) NOT NULL PRIMARY KEY,
      user_id INT NULL,
      warehouse_id INT NULL,
      waiting INT NOT NULL DEFAULT 0,
      refused INT NOT NULL DEFAULT 0,
      oldest_waiting_at DATETIME(3) NULL,
      reported_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      KEY ix_device_reports_at (reported_at),
      CONSTRAINT fk_device_reports_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT ck_device_reports CHECK (waiting >= 0 AND refused >= 0)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['device_outbox_reports', 'count_lines', 'count_bins', 'count_items', 'cycle_counts']) {
      await q.query(`DROP TABLE ${t}`)
    }
  }
}
