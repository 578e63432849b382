import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Every record an edit screen saves carries a version that goes up with each save: a save made on the version the
 * screen loaded, after someone else saved meanwhile, is refused instead of silently overwriting their work.
 */
const TABLES = ['takeoffs', 'quotes', 'items', 'customers', 'jobs', 'vendors', 'vendor_items', 'warehouses', 'price_levels']

export class EditVersions1796460000000 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    for (const table of TABLES) await q.query(`ALTER TABLE ${table} ADD COLUMN version INT NOT NULL DEFAULT 1`)
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of TABLES) await q.query(`ALTER TABLE ${table} DROP COLUMN version`)
  }
}
