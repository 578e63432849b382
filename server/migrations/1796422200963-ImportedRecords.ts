import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Records brought in by an import of the business's own data carry the import's id, so the import can be
 * reversed as a whole (its records removed while nothing else refers to them). NULL: made in Lumenyard.
 */
export class ImportedRecords1796422200963 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    for (const table of ['customers', 'vendors', 'vendor_items', 'purchase_orders']) {
      await q.query(`ALTER TABLE ${table} ADD COLUMN import_id INT NULL, ADD KEY ix_${table}_import (import_id),
        ADD CONSTRAINT fk_${table}_import FOREIGN KEY (import_id) REFERENCES data_imports(id)`)
    }
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['customers', 'vendors', 'vendor_items', 'purchase_orders']) {
      await q.query(`ALTER TABLE ${table} DROP FOREIGN KEY fk_${table}_import, DROP KEY ix_${table}_import, DROP COLUMN import_id`)
    }
  }
}
