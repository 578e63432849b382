import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'
const TABLES = ['warehouses', 'bins', 'price_levels', 'price_rules', 'reorder_policies']

/**
 * What a new business sets up before its stock can come in (warehouses, bins, price levels and their breaks,
 * reorder settings) can be imported too: those rows carry the import's id, so the import can be reversed as a
 * whole. Lead times observed before Lumenyard (days from sending an order to its first receipt of an item)
 * are kept beside the ones the ledger shows, so reorder points read the same spread of lead time from day one.
 */
export class SetupImports1796435000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    for (const table of TABLES) {
      await q.query(`ALTER TABLE ${table} ADD COLUMN import_id INT NULL, ADD KEY ix_${table}_import (import_id),
        ADD CONSTRAINT fk_${table}_import FOREIGN KEY (import_id) REFERENCES data_imports(id)`)
    }
    await q.query(`CREATE TABLE lead_time_history (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      import_id INT NOT NULL,
      vendor_id INT NOT NULL,
      item_id INT NOT NULL,
      order_ref VARCHAR(40) NOT NULL,
      seconds INT NOT NULL,
      UNIQUE KEY uq_lead_time_history (vendor_id, item_id, order_ref),
      KEY ix_lead_time_history_item (item_id),
      KEY ix_lead_time_history_import (import_id),
      CONSTRAINT fk_lead_time_history_import FOREIGN KEY (import_id) REFERENCES data_imports(id),
      CONSTRAINT fk_lead_time_history_vendor FOREIGN KEY (vendor_id) REFERENCES vendors(id),
      CONSTRAINT fk_lead_time_history_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT ck_lead_time_history_seconds CHECK (seconds >= 0)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE lead_time_history')
    for (const table of TABLES) {
      await q.query(`ALTER TABLE ${table} DROP FOREIGN KEY fk_${table}_import, DROP KEY ix_${table}_import, DROP COLUMN import_id`)
    }
  }
}
