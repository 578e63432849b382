import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * The ledger point at which a count line's figure was entered. Approving a variance checks that no other
 * count adjustment reached the same bin × item × lot after it (the variance would otherwise apply twice).
 */
export class CountEntryPoint1796397796030 implements MigrationInterface {
  name = 'CountEntryPoint1796397796030'

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE count_lines ADD COLUMN counted_move_id BIGINT NULL AFTER counted_at')
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE count_lines DROP COLUMN counted_move_id')
  }
}
