import type { MigrationInterface, QueryRunner } from 'typeorm'

/** The audit trail reads a person's entries and stock moves newest first, and entries of some actions. */
export class AuditTrail1796418594275 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE audit_entries ADD KEY ix_audit_user_at (user_id, at), ADD KEY ix_audit_action_at (action, at)')
    await q.query('ALTER TABLE stock_moves ADD KEY ix_moves_user_at (user_id, at)')
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE stock_moves DROP KEY ix_moves_user_at')
    await q.query('ALTER TABLE audit_entries DROP KEY ix_audit_user_at, DROP KEY ix_audit_action_at')
  }
}
