import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/** Contractor accounts, jobs, takeoffs and bills of materials; purchase orders and accepted suggestions. */
export class CounterPurchasing1764730000000 implements MigrationInterface {
  name = 'CounterPurchasing1764730000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE customers (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      code VARCHAR(20) NOT NULL,
      name VARCHAR(120) NOT NULL,
      contact_name VARCHAR(80) NULL,
      email VARCHAR(120) NULL,
      phone VARCHAR(40) NULL,
      address VARCHAR(200) NULL,
      notes TEXT NULL,
      active TINYINT(1) NOT NULL DEFAULT 1,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      UNIQUE KEY uq_customers_code (code)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE jobs (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      customer_id INT NOT NULL,
      name VARCHAR(120) NOT NULL,
      site_address VARCHAR(200) NULL,
      status VARCHAR(12) NOT NULL DEFAULT 'open',
      due_date DATE NULL,
      notes TEXT NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      KEY ix_jobs_customer (customer_id),
      CONSTRAINT fk_jobs_customer FOREIGN KEY (customer_id) REFERENCES customers(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE takeoffs (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      job_id INT NOT NULL,
      name VARCHAR(120) NOT NULL,
      input_json MEDIUMTEXT NOT NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      KEY ix_takeoffs_job (job_id),
      CONSTRAINT fk_takeoffs_job FOREIGN KEY (job_id) REFERENCES jobs(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE boms (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      job_id INT NOT NULL,
      takeoff_id INT NULL,
      revision INT NOT NULL DEFAULT 1,
      status VARCHAR(12) NOT NULL DEFAULT 'saved',
      cautions_json MEDIUMTEXT NULL,
      totals_json TEXT NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      UNIQUE KEY uq_boms_revision (job_id, revision),
      CONSTRAINT fk_boms_job FOREIGN KEY (job_id) REFERENCES jobs(id),
      CONSTRAINT fk_boms_takeoff FOREIGN KEY (takeoff_id) REFERENCES takeoffs(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE bom_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      bom_id INT NOT NULL,
      line_no INT NOT NULL,
      item_id INT NULL,
      role VARCHAR(20) NULL,
      sku VARCHAR(40) NULL,
      description VARCHAR(200) NOT NULL,
      qty INT NOT NULL,
      unit VARCHAR(10) NOT NULL,
      made_to_order TINYINT(1) NOT NULL DEFAULT 0,
      spec_json TEXT NULL,
      explanation_json MEDIUMTEXT NULL,
      picked_qty INT NOT NULL DEFAULT 0,
      ordered_qty INT NOT NULL DEFAULT 0,
      KEY ix_bom_lines_bom (bom_id),
      CONSTRAINT fk_bom_lines_bom FOREIGN KEY (bom_id) REFERENCES boms(id),
      CONSTRAINT fk_bom_lines_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT ck_bom_lines_qty CHECK (qty >= 0 AND picked_qty >= 0 AND ordered_qty >= 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE purchase_orders (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      number VARCHAR(20) NOT NULL,
      vendor_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      job_id INT NULL,
      status VARCHAR(16) NOT NULL DEFAULT 'draft',
      currency CHAR(3) NOT NULL DEFAULT 'USD',
      expected_date DATE NULL,
      notes TEXT NULL,
      total DECIMAL(14,2) NOT NULL DEFAULT 0,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      approved_by INT NULL,
      approved_at DATETIME NULL,
      sent_by INT NULL,
      sent_at DATETIME NULL,
      closed_at DATETIME NULL,
      cancelled_by INT NULL,
      cancelled_at DATETIME NULL,
      UNIQUE KEY uq_po_number (number),
      KEY ix_po_status (status),
      KEY ix_po_vendor (vendor_id),
      CONSTRAINT fk_po_vendor FOREIGN KEY (vendor_id) REFERENCES vendors(id),
      CONSTRAINT fk_po_warehouse FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_po_job FOREIGN KEY (job_id) REFERENCES jobs(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE purchase_order_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      po_id INT NOT NULL,
      line_no INT NOT NULL,
      item_id INT NOT NULL,
      vendor_sku VARCHAR(40) NULL,
      description VARCHAR(200) NOT NULL,
      pack_qty INT NOT NULL DEFAULT 1,
      packs_ordered INT NOT NULL,
      qty_ordered INT NOT NULL,
      qty_received INT NOT NULL DEFAULT 0,
      unit_cost DECIMAL(12,4) NOT NULL,
      bom_line_id INT NULL,
      spec_json TEXT NULL,
      KEY ix_pol_po (po_id),
      KEY ix_pol_item (item_id),
      CONSTRAINT fk_pol_po FOREIGN KEY (po_id) REFERENCES purchase_orders(id),
      CONSTRAINT fk_pol_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_pol_bom_line FOREIGN KEY (bom_line_id) REFERENCES bom_lines(id),
      CONSTRAINT ck_pol_qty CHECK (pack_qty > 0 AND packs_ordered > 0 AND qty_ordered = packs_ordered * pack_qty AND qty_received >= 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE purchase_suggestions (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      vendor_id INT NULL,
      qty INT NOT NULL,
      status VARCHAR(12) NOT NULL DEFAULT 'accepted',
      source VARCHAR(12) NOT NULL DEFAULT 'reorder',
      po_line_id INT NULL,
      explanation MEDIUMTEXT NULL,
      accepted_by INT NULL,
      accepted_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      KEY ix_suggestions_status (status, vendor_id),
      CONSTRAINT fk_sugg_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_sugg_wh FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT fk_sugg_vendor FOREIGN KEY (vendor_id) REFERENCES vendors(id),
      CONSTRAINT ck_sugg_qty CHECK (qty > 0)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['purchase_suggestions', 'purchase_order_lines', 'purchase_orders', 'bom_lines', 'boms', 'takeoffs', 'jobs', 'customers']) {
      await q.query(`DROP TABLE ${t}`)
    }
  }
}
