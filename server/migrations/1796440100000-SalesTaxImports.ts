import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Sales tax rates by warehouse can be imported: a rate carries its import's id, so the import can be reversed whole. */
export class SalesTaxImports1796440100000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE sales_tax_rates ADD COLUMN import_id INT NULL, ADD KEY ix_sales_tax_rates_import (import_id),
      ADD CONSTRAINT fk_sales_tax_rates_import FOREIGN KEY (import_id) REFERENCES data_imports(id)`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE sales_tax_rates DROP FOREIGN KEY fk_sales_tax_rates_import, DROP KEY ix_sales_tax_rates_import, DROP COLUMN import_id')
  }
}
