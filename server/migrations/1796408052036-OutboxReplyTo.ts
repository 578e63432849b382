import type { MigrationInterface, QueryRunner } from 'typeorm'

/** A message to a vendor names where replies go (the company's reply-to or the buyer); sending again keeps it. */
export class OutboxReplyTo1796408052036 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE outbox_messages ADD COLUMN reply_to VARCHAR(254) NULL AFTER cc')
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE outbox_messages DROP COLUMN reply_to')
  }
}
