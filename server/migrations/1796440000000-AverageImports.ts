import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * The moving-average cost of a warehouse that holds none of an item now, and the minimum set by hand, can be
 * imported: each line the import writes keeps what it had before and what the import made it, so the import can
 * be reversed as a whole while nothing has changed those lines since.
 */
export class AverageImports1796440000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE data_import_averages (
      import_id INT NOT NULL,
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      existed TINYINT NOT NULL,
      avg_before DECIMAL(14,4) NULL,
      min_before INT NULL,
      avg_after DECIMAL(14,4) NOT NULL,
      min_after INT NULL,
      PRIMARY KEY (import_id, item_id, warehouse_id),
      KEY ix_data_import_averages_line (item_id, warehouse_id),
      CONSTRAINT fk_data_import_averages_import FOREIGN KEY (import_id) REFERENCES data_imports(id),
      CONSTRAINT fk_data_import_averages_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_data_import_averages_warehouse FOREIGN KEY (warehouse_id) REFERENCES warehouses(id)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE data_import_averages')
  }
}
