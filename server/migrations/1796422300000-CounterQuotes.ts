import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/** Quotes to contractors with their priced lines (revisions kept), and quote e-mails in the outbox. */
export class CounterQuotes1796422300000 implements MigrationInterface {
  name = 'CounterQuotes1796422300000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE quotes (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      number VARCHAR(20) NULL,
      revision INT NOT NULL DEFAULT 1,
      status VARCHAR(10) NOT NULL DEFAULT 'draft',
      customer_id INT NOT NULL,
      job_id INT NULL,
      bom_id INT NULL,
      warehouse_id INT NOT NULL,
      quoted_on DATE NOT NULL,
      valid_until DATE NOT NULL,
      price_level_code VARCHAR(20) NULL,
      subtotal DECIMAL(14,2) NOT NULL DEFAULT 0,
      tax_rate DECIMAL(7,4) NOT NULL DEFAULT 0,
      tax_amount DECIMAL(14,2) NOT NULL DEFAULT 0,
      tax_json TEXT NULL,
      amount_due DECIMAL(14,2) NOT NULL DEFAULT 0,
      terms TEXT NULL,
      notes TEXT NULL,
      lost_reason VARCHAR(200) NULL,
      offered_at DATETIME NULL,
      taken_at DATETIME NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_quotes_number (number, revision),
      KEY ix_quotes_customer (customer_id, status),
      KEY ix_quotes_status (status, valid_until),
      CONSTRAINT fk_quotes_customer FOREIGN KEY (customer_id) REFERENCES customers(id),
      CONSTRAINT fk_quotes_job FOREIGN KEY (job_id) REFERENCES jobs(id),
      CONSTRAINT fk_quotes_bom FOREIGN KEY (bom_id) REFERENCES boms(id),
      CONSTRAINT fk_quotes_warehouse FOREIGN KEY (warehouse_id) REFERENCES warehouses(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE quote_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      quote_id INT NOT NULL,
      line_no INT NOT NULL,
      item_id INT NOT NULL,
      bom_line_id INT NULL,
      description VARCHAR(200) NOT NULL,
      asked_qty INT NOT NULL,
      qty INT NOT NULL,
      packs INT NULL,
      pack_size INT NOT NULL DEFAULT 1,
      unit_price DECIMAL(14,4) NOT NULL,
      pack_price DECIMAL(14,2) NULL,
      extension DECIMAL(14,2) NOT NULL,
      price_source VARCHAR(10) NOT NULL,
      explanation_json TEXT NOT NULL,
      override_price DECIMAL(12,2) NULL,
      override_reason VARCHAR(200) NULL,
      made_to_order TINYINT(1) NOT NULL DEFAULT 0,
      UNIQUE KEY uq_quote_lines (quote_id, line_no),
      CONSTRAINT fk_quote_lines_quote FOREIGN KEY (quote_id) REFERENCES quotes(id) ON DELETE CASCADE,
      CONSTRAINT fk_quote_lines_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_quote_lines_bom_line FOREIGN KEY (bom_line_id) REFERENCES bom_lines(id)
    ) ${TABLE}`)
    await q.query('ALTER TABLE outbox_messages ADD COLUMN quote_id INT NULL AFTER po_id, ADD KEY ix_outbox_quote (quote_id)')
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE outbox_messages DROP KEY ix_outbox_quote, DROP COLUMN quote_id')
    await q.query('DROP TABLE quote_lines')
    await q.query('DROP TABLE quotes')
  }
}
