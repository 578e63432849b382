import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Every problem a check found, one row each, tied to the run that found it: the page reads them a page at a
 * time (all of them, or one column's), so a file with tens of thousands of bad rows answers every one without
 * holding them in the app's memory. They go with their run (ON DELETE CASCADE) when old runs are cleared.
 */
export class DataImportProblems1796470000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE data_import_problems (
      run_id CHAR(36) NOT NULL,
      seq INT NOT NULL,
      row_no INT NOT NULL,
      label VARCHAR(255) NULL,
      col VARCHAR(80) NULL,
      code VARCHAR(64) NOT NULL,
      params TEXT NULL,
      PRIMARY KEY (run_id, seq),
      KEY ix_data_import_problems_col (run_id, col, seq),
      CONSTRAINT fk_data_import_problems_run FOREIGN KEY (run_id) REFERENCES data_import_runs(id) ON DELETE CASCADE
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE data_import_problems')
  }
}
