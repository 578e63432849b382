import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * The card-payment provider's signed events, one row per provider event id: a replayed or retried event
 * finds its row and is not handled twice. Only what the app needs is kept (never card details).
 */
export class PaymentEvents1796428410423 implements MigrationInterface {
  name = 'PaymentEvents1796428410423'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE payment_events (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      provider_event_id VARCHAR(255) NOT NULL,
      type VARCHAR(100) NOT NULL,
      object_id VARCHAR(255) NULL,
      amount DECIMAL(12,2) NULL,
      currency CHAR(3) NULL,
      object_status VARCHAR(40) NULL,
      provider_created_at DATETIME NULL,
      received_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      deliveries INT NOT NULL DEFAULT 1,
      outcome VARCHAR(40) NOT NULL DEFAULT 'noted',
      UNIQUE KEY uq_payment_events_provider (provider_event_id),
      KEY ix_payment_events_object (object_id)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE payment_events')
  }
}
