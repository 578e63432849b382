import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/** Selling prices: price levels, item price rules with quantity breaks, sales tax per warehouse, accounts' terms. */
export class SellingPrices1796418557973 implements MigrationInterface {
  name = 'SellingPrices1796418557973'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE price_levels (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      code VARCHAR(20) NOT NULL,
      name VARCHAR(80) NOT NULL,
      percent_off DECIMAL(5,2) NULL,
      active TINYINT(1) NOT NULL DEFAULT 1,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      UNIQUE KEY uq_price_levels_code (code)
    ) ${TABLE}`)
    // level_key is 0 for a rule that holds for every account, so the unique key also covers those.
    await q.query(`CREATE TABLE price_rules (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      level_id INT NULL,
      level_key INT AS (COALESCE(level_id, 0)) PERSISTENT,
      item_id INT NOT NULL,
      min_qty INT NOT NULL DEFAULT 1,
      basis VARCHAR(4) NOT NULL DEFAULT 'unit',
      price DECIMAL(12,2) NULL,
      percent_off DECIMAL(5,2) NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      UNIQUE KEY uq_price_rules (item_id, level_key, basis, min_qty),
      KEY ix_price_rules_level (level_id),
      CONSTRAINT fk_price_rules_level FOREIGN KEY (level_id) REFERENCES price_levels(id) ON DELETE CASCADE,
      CONSTRAINT fk_price_rules_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT ck_price_rules_one CHECK ((price IS NULL) <> (percent_off IS NULL))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE sales_tax_rates (
      warehouse_id INT NOT NULL PRIMARY KEY,
      rate_percent DECIMAL(7,4) NOT NULL,
      label VARCHAR(80) NULL,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      CONSTRAINT fk_sales_tax_warehouse FOREIGN KEY (warehouse_id) REFERENCES warehouses(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE customer_terms (
      customer_id INT NOT NULL PRIMARY KEY,
      price_level_id INT NULL,
      exempt_certificate VARCHAR(40) NULL,
      exempt_until DATE NULL,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      KEY ix_customer_terms_level (price_level_id),
      CONSTRAINT fk_customer_terms_customer FOREIGN KEY (customer_id) REFERENCES customers(id) ON DELETE CASCADE,
      CONSTRAINT fk_customer_terms_level FOREIGN KEY (price_level_id) REFERENCES price_levels(id)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE customer_terms')
    await q.query('DROP TABLE sales_tax_rates')
    await q.query('DROP TABLE price_rules')
    await q.query('DROP TABLE price_levels')
  }
}
