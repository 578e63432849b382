import type { MigrationInterface, QueryRunner } from 'typeorm'

/** Each person's weight unit (pounds or kilograms) for the handheld and the pick sheet; metric users start with kilograms. */
export class WeightUnit1796404704802 implements MigrationInterface {
  name = 'WeightUnit1796404704802'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users ADD COLUMN weight_unit VARCHAR(2) NOT NULL DEFAULT 'lb' AFTER unit_preference`)
    await q.query(`UPDATE users SET weight_unit = 'kg' WHERE unit_preference = 'mm'`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE users DROP COLUMN weight_unit')
  }
}
