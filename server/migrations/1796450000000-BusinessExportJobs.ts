import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Everything-out jobs live in the database, so every app process behind a proxy answers the same job's progress
 * and file. `running_slot` is 1 while a job runs and NULL otherwise: its unique key lets one export run at a time
 * across processes. `heartbeat_at` moves while the job's process works; a running job whose heartbeat stopped
 * (the process died) is seen as failed.
 */
export class BusinessExportJobs1796450000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE business_export_jobs (
      id CHAR(36) NOT NULL PRIMARY KEY,
      state VARCHAR(10) NOT NULL,
      running_slot TINYINT NULL,
      rows_total INT NULL,
      rows_done INT NOT NULL DEFAULT 0,
      filename VARCHAR(120) NOT NULL,
      file_path VARCHAR(500) NOT NULL,
      bytes BIGINT NULL,
      user_id INT NULL,
      started_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      heartbeat_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      finished_at DATETIME(3) NULL,
      expires_at DATETIME(3) NULL,
      UNIQUE KEY uq_business_export_jobs_running (running_slot),
      KEY ix_business_export_jobs_started (started_at),
      CONSTRAINT fk_business_export_jobs_user FOREIGN KEY (user_id) REFERENCES users(id)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE business_export_jobs')
  }
}
