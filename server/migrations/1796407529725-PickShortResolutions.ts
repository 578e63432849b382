import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * A line closed short on the handheld is resolved later by a backorder or a substitute: the
 * shortage row then names the pick list line it settles (NULL for the choices made with the list).
 */
export class PickShortResolutions1796407529725 implements MigrationInterface {
  name = 'PickShortResolutions1796407529725'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE pick_shortages ADD COLUMN pick_list_line_id INT NULL AFTER bom_line_id,
      ADD KEY ix_pick_shortages_line (pick_list_line_id),
      ADD CONSTRAINT fk_pick_short_line FOREIGN KEY (pick_list_line_id) REFERENCES pick_list_lines(id)`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE pick_shortages DROP FOREIGN KEY fk_pick_short_line')
    await q.query('ALTER TABLE pick_shortages DROP KEY ix_pick_shortages_line, DROP COLUMN pick_list_line_id')
  }
}
