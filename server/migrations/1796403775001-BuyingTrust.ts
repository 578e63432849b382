import type { MigrationInterface, QueryRunner } from 'typeorm'

/**
 * Purchase orders carry a version so a stale edit or approval is refused; a failed e-mail can be sent
 * again once (retry_of) and carries any number of attachments (the PO as PDF and as a spreadsheet);
 * the company profile (one row) says who orders on every document.
 */
export class BuyingTrust1796403775001 implements MigrationInterface {
  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE purchase_orders ADD COLUMN version INT NOT NULL DEFAULT 1')
    await q.query(`ALTER TABLE outbox_messages
      ADD COLUMN retry_of INT NULL,
      ADD CONSTRAINT uq_outbox_retry_of UNIQUE (retry_of),
      ADD CONSTRAINT fk_outbox_retry_of FOREIGN KEY (retry_of) REFERENCES outbox_messages(id)`)
    await q.query(`CREATE TABLE outbox_attachments (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      message_id INT NOT NULL,
      name VARCHAR(120) NOT NULL,
      content_type VARCHAR(100) NOT NULL,
      bytes MEDIUMBLOB NOT NULL,
      CONSTRAINT fk_outbox_attachment_message FOREIGN KEY (message_id) REFERENCES outbox_messages(id)
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
    await q.query(`INSERT INTO outbox_attachments (message_id, name, content_type, bytes)
      SELECT id, attachment_name, COALESCE(attachment_type, 'application/octet-stream'), attachment FROM outbox_messages
       WHERE attachment IS NOT NULL AND attachment_name IS NOT NULL ORDER BY id`)
    await q.query('ALTER TABLE outbox_messages DROP COLUMN attachment, DROP COLUMN attachment_type, DROP COLUMN attachment_name')
    await q.query(`CREATE TABLE company_profile (
      id TINYINT NOT NULL PRIMARY KEY,
      legal_name VARCHAR(160) NOT NULL DEFAULT '',
      bill_to_address VARCHAR(400) NULL,
      ship_to_address VARCHAR(400) NULL,
      phone VARCHAR(40) NULL,
      email VARCHAR(254) NULL,
      reply_to VARCHAR(254) NULL,
      tax_number VARCHAR(40) NULL,
      document_unit VARCHAR(2) NOT NULL DEFAULT 'in',
      logo MEDIUMBLOB NULL,
      logo_type VARCHAR(40) NULL,
      updated_by INT NULL,
      updated_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP,
      CONSTRAINT ck_company_profile_one CHECK (id = 1),
      CONSTRAINT ck_company_profile_unit CHECK (document_unit IN ('in', 'mm'))
    ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE company_profile')
    await q.query(`ALTER TABLE outbox_messages ADD COLUMN attachment_name VARCHAR(120) NULL, ADD COLUMN attachment_type VARCHAR(100) NULL,
      ADD COLUMN attachment MEDIUMBLOB NULL`)
    await q.query(`UPDATE outbox_messages m JOIN (SELECT message_id, MIN(id) AS first FROM outbox_attachments GROUP BY message_id) f ON f.message_id = m.id
      JOIN outbox_attachments a ON a.id = f.first SET m.attachment_name = a.name, m.attachment_type = a.content_type, m.attachment = a.bytes`)
    await q.query('DROP TABLE outbox_attachments')
    await q.query('ALTER TABLE outbox_messages DROP FOREIGN KEY fk_outbox_retry_of, DROP INDEX uq_outbox_retry_of, DROP COLUMN retry_of')
    await q.query('ALTER TABLE purchase_orders DROP COLUMN version')
  }
}
