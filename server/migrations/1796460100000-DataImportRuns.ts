import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * An import's check or commit while it runs, and its answer for a while after: rows read, checked and written
 * against the file's rows, so the page shows a true percentage and finds the run again after a reload (from any
 * app process). `running_key` (user, kind, step, checksum) is set while a check runs: its unique key makes a
 * second check of the same file by the same person (a double click) follow the first rather than run again.
 */
export class DataImportRuns1796460100000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE data_import_runs (
      id CHAR(36) NOT NULL PRIMARY KEY,
      user_id INT NOT NULL,
      kind VARCHAR(24) NOT NULL,
      step VARCHAR(8) NOT NULL,
      file_name VARCHAR(255) NOT NULL,
      checksum CHAR(64) NOT NULL,
      state VARCHAR(8) NOT NULL,
      running_key VARCHAR(120) NULL,
      rows_total INT NULL,
      rows_read INT NOT NULL DEFAULT 0,
      rows_checked INT NOT NULL DEFAULT 0,
      rows_written INT NOT NULL DEFAULT 0,
      answer MEDIUMTEXT NULL,
      problem TEXT NULL,
      started_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      heartbeat_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      finished_at DATETIME(3) NULL,
      UNIQUE KEY uq_data_import_runs_running (running_key),
      KEY ix_data_import_runs_user (user_id, started_at),
      CONSTRAINT fk_data_import_runs_user FOREIGN KEY (user_id) REFERENCES users(id)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE data_import_runs')
  }
}
