import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Sales orders made when a contractor takes a quote (one order per quote row), their lines with what is
 * held, picked, handed over and returned, and the payments recorded against an order (cash and cheque
 * by hand; card rows come from the payment provider).
 */
export class SalesOrders1796425000000 implements MigrationInterface {
  name = 'SalesOrders1796425000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE sales_orders (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      number VARCHAR(20) NULL,
      quote_id INT NOT NULL,
      customer_id INT NOT NULL,
      job_id INT NULL,
      warehouse_id INT NOT NULL,
      status VARCHAR(12) NOT NULL DEFAULT 'booked',
      subtotal DECIMAL(14,2) NOT NULL DEFAULT 0,
      tax_amount DECIMAL(14,2) NOT NULL DEFAULT 0,
      total DECIMAL(14,2) NOT NULL DEFAULT 0,
      deposit_percent DECIMAL(5,2) NOT NULL DEFAULT 0,
      deposit_required DECIMAL(12,2) NOT NULL DEFAULT 0,
      deposit_paid DECIMAL(12,2) NOT NULL DEFAULT 0,
      cancel_reason VARCHAR(200) NULL,
      cancelled_by INT NULL,
      cancelled_at DATETIME NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_sales_orders_quote (quote_id),
      UNIQUE KEY uq_sales_orders_number (number),
      KEY ix_sales_orders_customer (customer_id, status),
      KEY ix_sales_orders_status (status, created_at),
      CONSTRAINT fk_sales_orders_quote FOREIGN KEY (quote_id) REFERENCES quotes(id),
      CONSTRAINT fk_sales_orders_customer FOREIGN KEY (customer_id) REFERENCES customers(id),
      CONSTRAINT fk_sales_orders_job FOREIGN KEY (job_id) REFERENCES jobs(id),
      CONSTRAINT fk_sales_orders_warehouse FOREIGN KEY (warehouse_id) REFERENCES warehouses(id),
      CONSTRAINT ck_sales_orders_money CHECK (deposit_required >= 0 AND deposit_paid >= 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE sales_order_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      sales_order_id INT NOT NULL,
      line_no INT NOT NULL,
      quote_line_id INT NULL,
      bom_line_id INT NULL,
      item_id INT NOT NULL,
      description VARCHAR(200) NOT NULL,
      qty INT NOT NULL,
      unit_price DECIMAL(14,4) NOT NULL,
      extension DECIMAL(14,2) NOT NULL,
      tax DECIMAL(14,2) NOT NULL DEFAULT 0,
      made_to_order TINYINT(1) NOT NULL DEFAULT 0,
      qty_reserved INT NOT NULL DEFAULT 0,
      qty_picked INT NOT NULL DEFAULT 0,
      qty_handed_over INT NOT NULL DEFAULT 0,
      qty_returned INT NOT NULL DEFAULT 0,
      po_line_id INT NULL,
      UNIQUE KEY uq_sales_order_lines (sales_order_id, line_no),
      KEY ix_sales_order_lines_po_line (po_line_id),
      CONSTRAINT fk_sales_order_lines_order FOREIGN KEY (sales_order_id) REFERENCES sales_orders(id) ON DELETE CASCADE,
      CONSTRAINT fk_sales_order_lines_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_sales_order_lines_po_line FOREIGN KEY (po_line_id) REFERENCES purchase_order_lines(id),
      CONSTRAINT ck_sales_order_lines_qty CHECK (qty > 0 AND qty_reserved >= 0 AND qty_picked >= 0 AND qty_handed_over >= 0 AND qty_returned >= 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE payments (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      sales_order_id INT NOT NULL,
      method VARCHAR(8) NOT NULL,
      amount DECIMAL(12,2) NOT NULL,
      status VARCHAR(12) NOT NULL DEFAULT 'settled',
      reference VARCHAR(100) NULL,
      provider_event_id VARCHAR(100) NULL,
      recorded_by INT NULL,
      recorded_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      refunded_amount DECIMAL(12,2) NOT NULL DEFAULT 0,
      UNIQUE KEY uq_payments_provider_event (provider_event_id),
      KEY ix_payments_order (sales_order_id, recorded_at),
      CONSTRAINT fk_payments_order FOREIGN KEY (sales_order_id) REFERENCES sales_orders(id),
      CONSTRAINT ck_payments_method CHECK (method IN ('cash', 'cheque', 'card')),
      CONSTRAINT ck_payments_amount CHECK (amount > 0 AND refunded_amount >= 0 AND refunded_amount <= amount)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE payments')
    await q.query('DROP TABLE sales_order_lines')
    await q.query('DROP TABLE sales_orders')
  }
}
