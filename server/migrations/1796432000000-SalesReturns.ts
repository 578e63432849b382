import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Goods returned against a sales order: the return (its figures to the cent, how the money went back),
 * its lines (which order line, how many, into which bin and lot, the stock move that took them in), and the
 * contractors' account credits (a return settled as credit adds one).
 */
export class SalesReturns1796432000000 implements MigrationInterface {
  name = 'SalesReturns1796432000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE sales_returns (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      number VARCHAR(20) NULL,
      sales_order_id INT NOT NULL,
      customer_id INT NOT NULL,
      settle_by VARCHAR(8) NOT NULL,
      reference VARCHAR(100) NULL,
      payment_id INT NULL,
      goods DECIMAL(14,2) NOT NULL,
      tax DECIMAL(14,2) NOT NULL,
      restocking_percent DECIMAL(5,2) NOT NULL,
      restocking_fee DECIMAL(14,2) NOT NULL,
      refund DECIMAL(14,2) NOT NULL,
      note VARCHAR(200) NULL,
      created_by INT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      UNIQUE KEY uq_sales_returns_number (number),
      KEY ix_sales_returns_order (sales_order_id),
      KEY ix_sales_returns_payment (payment_id),
      CONSTRAINT fk_sales_returns_order FOREIGN KEY (sales_order_id) REFERENCES sales_orders(id),
      CONSTRAINT fk_sales_returns_customer FOREIGN KEY (customer_id) REFERENCES customers(id),
      CONSTRAINT fk_sales_returns_payment FOREIGN KEY (payment_id) REFERENCES payments(id),
      CONSTRAINT ck_sales_returns_settle CHECK (settle_by IN ('credit', 'cash', 'cheque', 'card')),
      CONSTRAINT ck_sales_returns_money CHECK (goods >= 0 AND tax >= 0 AND restocking_fee >= 0 AND refund >= 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE sales_return_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      return_id INT NOT NULL,
      sales_order_line_id INT NOT NULL,
      item_id INT NOT NULL,
      qty INT NOT NULL,
      goods DECIMAL(14,2) NOT NULL,
      tax DECIMAL(14,2) NOT NULL,
      bin_id INT NOT NULL,
      lot_id INT NULL,
      KEY ix_sales_return_lines_return (return_id),
      CONSTRAINT fk_sales_return_lines_return FOREIGN KEY (return_id) REFERENCES sales_returns(id),
      CONSTRAINT fk_sales_return_lines_line FOREIGN KEY (sales_order_line_id) REFERENCES sales_order_lines(id),
      CONSTRAINT ck_sales_return_lines_qty CHECK (qty > 0)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE account_credits (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      customer_id INT NOT NULL,
      amount DECIMAL(14,2) NOT NULL,
      sales_return_id INT NULL,
      note VARCHAR(200) NULL,
      created_by INT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      KEY ix_account_credits_customer (customer_id),
      UNIQUE KEY uq_account_credits_return (sales_return_id),
      CONSTRAINT fk_account_credits_customer FOREIGN KEY (customer_id) REFERENCES customers(id),
      CONSTRAINT fk_account_credits_return FOREIGN KEY (sales_return_id) REFERENCES sales_returns(id)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE account_credits')
    await q.query('DROP TABLE sales_return_lines')
    await q.query('DROP TABLE sales_returns')
  }
}
