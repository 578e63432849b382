import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Every committed import of a business's own data (who, when, file, rows, checksum), so the same file
 * committed twice changes nothing the second time (one standing record per kind and checksum), and an import
 * can be reversed as a whole. data_import_costs keeps each item × warehouse moving average and on hand as
 * they were before an opening-stock import, which its reversal puts back.
 */
export class DataImports1796418546429 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE data_imports (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      kind VARCHAR(24) NOT NULL,
      file_name VARCHAR(255) NOT NULL,
      checksum CHAR(64) NOT NULL,
      row_count INT NOT NULL,
      user_id INT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      reversed_at DATETIME(3) NULL,
      reversed_by INT NULL,
      summary TEXT NULL,
      live_checksum CHAR(64) NULL COMMENT 'the checksum while the import stands; NULL once reversed',
      UNIQUE KEY uq_data_imports_live (kind, live_checksum),
      KEY ix_data_imports_created (created_at),
      CONSTRAINT fk_data_imports_user FOREIGN KEY (user_id) REFERENCES users(id),
      CONSTRAINT fk_data_imports_reverser FOREIGN KEY (reversed_by) REFERENCES users(id)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE data_import_costs (
      import_id INT NOT NULL,
      item_id INT NOT NULL,
      warehouse_id INT NOT NULL,
      avg_before DECIMAL(12,4) NOT NULL,
      on_hand_before INT NOT NULL,
      PRIMARY KEY (import_id, item_id, warehouse_id),
      CONSTRAINT fk_import_costs_import FOREIGN KEY (import_id) REFERENCES data_imports(id)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE data_import_costs')
    await q.query('DROP TABLE data_imports')
  }
}
