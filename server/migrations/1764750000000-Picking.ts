import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/** Pick lists from a bill of materials: lines by bin and lot, scanner confirmations, shortages, proposed transfers. */
export class Picking1764750000000 implements MigrationInterface {
  name = 'Picking1764750000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE pick_lists (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      bom_id INT NOT NULL,
      job_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      status VARCHAR(12) NOT NULL DEFAULT 'draft',
      note VARCHAR(200) NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      released_by INT NULL,
      released_at DATETIME NULL,
      started_by INT NULL,
      started_at DATETIME NULL,
      picked_by INT NULL,
      picked_at DATETIME NULL,
      cancelled_by INT NULL,
      cancelled_at DATETIME NULL,
      cancel_reason VARCHAR(200) NULL,
      updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      KEY ix_pick_lists_wh_status (warehouse_id, status),
      KEY ix_pick_lists_bom (bom_id),
      KEY ix_pick_lists_job (job_id),
      CONSTRAINT fk_pick_lists_bom FOREIGN KEY (bom_id) REFERENCES boms(id),
      CONSTRAINT fk_pick_lists_job FOREIGN KEY (job_id) REFERENCES jobs(id),
      CONSTRAINT fk_pick_lists_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT ck_pick_lists_status CHECK (status IN ('draft', 'released', 'picking', 'picked', 'cancelled'))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE pick_list_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      pick_list_id INT NOT NULL,
      bom_line_id INT NOT NULL,
      item_id INT NOT NULL,
      substitute_for_item_id INT NULL,
      bin_id INT NOT NULL,
      lot_id INT NULL,
      qty INT NOT NULL,
      confirmed_qty INT NOT NULL DEFAULT 0,
      short_qty INT NOT NULL DEFAULT 0,
      issued_qty INT NOT NULL DEFAULT 0,
      KEY ix_pick_lines_list (pick_list_id),
      KEY ix_pick_lines_bom_line (bom_line_id),
      CONSTRAINT fk_pick_lines_list FOREIGN KEY (pick_list_id) REFERENCES pick_lists(id),
      CONSTRAINT fk_pick_lines_bom_line FOREIGN KEY (bom_line_id) REFERENCES bom_lines(id),
      CONSTRAINT fk_pick_lines_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_pick_lines_bin FOREIGN KEY (bin_id) REFERENCES bins(id),
      CONSTRAINT fk_pick_lines_lot FOREIGN KEY (lot_id) REFERENCES lots(id),
      CONSTRAINT ck_pick_lines_qty CHECK (qty > 0 AND confirmed_qty >= 0 AND short_qty >= 0 AND confirmed_qty + short_qty <= qty
        AND issued_qty >= 0 AND issued_qty <= confirmed_qty)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE pick_confirmations (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      pick_list_id INT NOT NULL,
      line_id INT NOT NULL,
      qty INT NOT NULL,
      short_qty INT NOT NULL DEFAULT 0,
      short_reason VARCHAR(20) NULL,
      client_key VARCHAR(100) NOT NULL,
      bin_scan VARCHAR(200) NOT NULL,
      item_scan VARCHAR(200) NULL,
      lot_scan VARCHAR(200) NULL,
      scanned_at DATETIME(3) NULL,
      confirmed_by INT NULL,
      confirmed_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      move_id BIGINT NULL,
      issued_at DATETIME NULL,
      UNIQUE KEY uq_pick_confirmations_key (client_key),
      KEY ix_pick_confirmations_list (pick_list_id, id),
      CONSTRAINT fk_pick_conf_list FOREIGN KEY (pick_list_id) REFERENCES pick_lists(id),
      CONSTRAINT fk_pick_conf_line FOREIGN KEY (line_id) REFERENCES pick_list_lines(id),
      CONSTRAINT ck_pick_conf_qty CHECK (qty >= 0 AND short_qty >= 0 AND qty + short_qty > 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE pick_shortages (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      pick_list_id INT NOT NULL,
      bom_line_id INT NOT NULL,
      item_id INT NOT NULL,
      qty INT NOT NULL,
      action VARCHAR(12) NOT NULL,
      suggestion_id INT NULL,
      substitute_item_id INT NULL,
      from_warehouse_id INT NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      KEY ix_pick_shortages_list (pick_list_id),
      KEY ix_pick_shortages_bom_line (bom_line_id),
      CONSTRAINT fk_pick_short_list FOREIGN KEY (pick_list_id) REFERENCES pick_lists(id),
      CONSTRAINT fk_pick_short_bom_line FOREIGN KEY (bom_line_id) REFERENCES bom_lines(id),
      CONSTRAINT fk_pick_short_suggestion FOREIGN KEY (suggestion_id) REFERENCES purchase_suggestions(id),
      CONSTRAINT ck_pick_short_qty CHECK (qty > 0 AND action IN ('leave', 'backorder', 'transfer', 'substitute'))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE pick_transfer_proposals (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      pick_list_id INT NOT NULL,
      bom_line_id INT NOT NULL,
      item_id INT NOT NULL,
      lot_id INT NULL,
      from_warehouse_id INT NOT NULL,
      from_bin_id INT NOT NULL,
      to_warehouse_id INT NOT NULL,
      qty INT NOT NULL,
      status VARCHAR(12) NOT NULL DEFAULT 'proposed',
      transfer_id INT NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      shipped_by INT NULL,
      shipped_at DATETIME NULL,
      KEY ix_pick_transfers_list (pick_list_id, from_warehouse_id, status),
      CONSTRAINT fk_pick_tr_list FOREIGN KEY (pick_list_id) REFERENCES pick_lists(id),
      CONSTRAINT fk_pick_tr_from_wh FOREIGN KEY (from_warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_pick_tr_to_wh FOREIGN KEY (to_warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_pick_tr_transfer FOREIGN KEY (transfer_id) REFERENCES transfers(id),
      CONSTRAINT ck_pick_tr CHECK (qty > 0 AND status IN ('proposed', 'shipped', 'cancelled'))
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['pick_transfer_proposals', 'pick_shortages', 'pick_confirmations', 'pick_list_lines', 'pick_lists']) {
      await q.query(`DROP TABLE ${t}`)
    }
  }
}
