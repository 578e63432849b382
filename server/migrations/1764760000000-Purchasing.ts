import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Purchasing: who received and closed a PO and why, damaged units per line, the PO number counter,
 * receipts against POs, the mail outbox and the app settings (admin toggles).
 */
export class Purchasing1764760000000 implements MigrationInterface {
  name = 'Purchasing1764760000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE purchase_orders
      ADD COLUMN received_by INT NULL,
      ADD COLUMN received_at DATETIME NULL,
      ADD COLUMN closed_by INT NULL,
      ADD COLUMN close_reason VARCHAR(200) NULL,
      ADD COLUMN cancel_reason VARCHAR(200) NULL,
      ADD COLUMN send_error VARCHAR(500) NULL`)
    await q.query(`ALTER TABLE purchase_order_lines
      ADD COLUMN qty_damaged INT NOT NULL DEFAULT 0,
      ADD CONSTRAINT ck_pol_damaged CHECK (qty_damaged >= 0)`)
    // One row per year; the increment holds the row lock until commit, so numbers have no gaps.
    await q.query(`CREATE TABLE po_number_counters (
      po_year INT NOT NULL PRIMARY KEY,
      last_number INT NOT NULL
    ) ${TABLE}`)
    await q.query(`CREATE TABLE po_receipts (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      po_id INT NOT NULL,
      received_by INT NULL,
      received_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      note VARCHAR(200) NULL,
      batch_id CHAR(36) NULL,
      KEY ix_po_receipts_po (po_id),
      CONSTRAINT fk_po_receipts_po FOREIGN KEY (po_id) REFERENCES purchase_orders(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE po_receipt_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      receipt_id INT NOT NULL,
      po_line_id INT NOT NULL,
      item_id INT NOT NULL,
      bin_id INT NOT NULL,
      lot_id INT NULL,
      qty INT NOT NULL,
      qty_damaged INT NOT NULL DEFAULT 0,
      variance VARCHAR(10) NULL,
      reason VARCHAR(200) NULL,
      issued_to_job_id INT NULL,
      KEY ix_prl_receipt (receipt_id),
      KEY ix_prl_po_line (po_line_id),
      CONSTRAINT fk_prl_receipt FOREIGN KEY (receipt_id) REFERENCES po_receipts(id),
      CONSTRAINT fk_prl_po_line FOREIGN KEY (po_line_id) REFERENCES purchase_order_lines(id),
      CONSTRAINT fk_prl_bin FOREIGN KEY (bin_id) REFERENCES bins(id),
      CONSTRAINT fk_prl_lot FOREIGN KEY (lot_id) REFERENCES lots(id),
      CONSTRAINT ck_prl_qty CHECK (qty >= 0 AND qty_damaged >= 0 AND qty + qty_damaged > 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE outbox_messages (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      sent_at DATETIME(3) NULL,
      status VARCHAR(8) NOT NULL,
      from_address VARCHAR(200) NOT NULL,
      to_address VARCHAR(300) NOT NULL,
      cc VARCHAR(700) NULL,
      subject VARCHAR(200) NOT NULL,
      body_text TEXT NOT NULL,
      error VARCHAR(500) NULL,
      message_id VARCHAR(200) NULL,
      po_id INT NULL,
      attachment_name VARCHAR(120) NULL,
      attachment_type VARCHAR(100) NULL,
      attachment MEDIUMBLOB NULL,
      created_by INT NULL,
      KEY ix_outbox_created (created_at),
      KEY ix_outbox_po (po_id),
      CONSTRAINT fk_outbox_po FOREIGN KEY (po_id) REFERENCES purchase_orders(id),
      CONSTRAINT ck_outbox_status CHECK (status IN ('sent', 'failed'))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE app_settings (
      setting_key VARCHAR(60) NOT NULL PRIMARY KEY,
      value VARCHAR(500) NOT NULL,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['app_settings', 'outbox_messages', 'po_receipt_lines', 'po_receipts', 'po_number_counters']) {
      await q.query(`DROP TABLE ${t}`)
    }
    await q.query('ALTER TABLE purchase_order_lines DROP CONSTRAINT ck_pol_damaged, DROP COLUMN qty_damaged')
    await q.query(`ALTER TABLE purchase_orders DROP COLUMN received_by, DROP COLUMN received_at, DROP COLUMN closed_by,
      DROP COLUMN close_reason, DROP COLUMN cancel_reason, DROP COLUMN send_error`)
  }
}
