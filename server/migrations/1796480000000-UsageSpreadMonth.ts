import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Which imported usage came as a month total spread over its days (the month, YYYY-MM) rather than day by day
 * (null): a spread month writes only the days its units reach, so without it a later day row of that month would
 * find nothing held on its day and the month would be counted twice.
 */
export class UsageSpreadMonth1796480000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE usage_history ADD COLUMN spread_month CHAR(7) NULL')
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE usage_history DROP COLUMN spread_month')
  }
}
