import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Files any app process can serve, kept in MariaDB rather than on one server's disk: an import's upload between
 * its check and its commit, an everything-out zip until it is downloaded. A file is written and read in parts of
 * about 1 MB (each far below max_allowed_packet), so a large one never sits whole in memory; it goes, parts and
 * all, once past `expires_at`.
 */
export class StoredFiles1796470100000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE stored_files (
      id CHAR(36) NOT NULL PRIMARY KEY,
      purpose VARCHAR(24) NOT NULL,
      name VARCHAR(255) NOT NULL,
      bytes BIGINT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      expires_at DATETIME(3) NOT NULL,
      KEY ix_stored_files_expires (expires_at)
    ) ${TABLE}`)
    await q.query(`CREATE TABLE stored_file_parts (
      file_id CHAR(36) NOT NULL,
      seq INT NOT NULL,
      data LONGBLOB NOT NULL,
      PRIMARY KEY (file_id, seq),
      CONSTRAINT fk_stored_file_parts_file FOREIGN KEY (file_id) REFERENCES stored_files(id) ON DELETE CASCADE
    ) ${TABLE}`)
    await q.query('ALTER TABLE business_export_jobs DROP COLUMN file_path, ADD COLUMN file_id CHAR(36) NULL')
    await q.query('ALTER TABLE data_import_runs ADD COLUMN upload_id CHAR(36) NULL')
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE data_import_runs DROP COLUMN upload_id')
    await q.query("ALTER TABLE business_export_jobs DROP COLUMN file_id, ADD COLUMN file_path VARCHAR(500) NOT NULL DEFAULT ''")
    await q.query('DROP TABLE stored_file_parts')
    await q.query('DROP TABLE stored_files')
  }
}
