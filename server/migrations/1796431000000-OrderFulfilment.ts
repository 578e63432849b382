import type { MigrationInterface, QueryRunner } from 'typeorm'

const TABLE = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci'

/**
 * Fulfilling sales orders: a pick list may come from a sales order instead of a bill of materials (its
 * lines point at the order's lines); order lines count what is backordered and cancelled; the order
 * records when it became ready and when the contractor was told; handover tickets (pickup or delivery)
 * list what leaves by bin and lot, carry the signature as a PNG and the stock move of each line.
 */
export class OrderFulfilment1796431000000 implements MigrationInterface {
  name = 'OrderFulfilment1796431000000'

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE pick_lists MODIFY bom_id INT NULL, MODIFY job_id INT NULL,
      ADD COLUMN sales_order_id INT NULL AFTER job_id,
      ADD KEY ix_pick_lists_sales_order (sales_order_id, status),
      ADD CONSTRAINT fk_pick_lists_sales_order FOREIGN KEY (sales_order_id) REFERENCES sales_orders(id),
      ADD CONSTRAINT ck_pick_lists_source CHECK (bom_id IS NOT NULL OR sales_order_id IS NOT NULL)`)
    await q.query(`ALTER TABLE pick_list_lines MODIFY bom_line_id INT NULL,
      ADD COLUMN sales_order_line_id INT NULL AFTER bom_line_id,
      ADD CONSTRAINT fk_pick_lines_sales_line FOREIGN KEY (sales_order_line_id) REFERENCES sales_order_lines(id)`)
    await q.query('ALTER TABLE pick_shortages MODIFY bom_line_id INT NULL')
    await q.query(`ALTER TABLE sales_order_lines
      ADD COLUMN qty_backordered INT NOT NULL DEFAULT 0 AFTER qty_handed_over,
      ADD COLUMN qty_cancelled INT NOT NULL DEFAULT 0 AFTER qty_backordered,
      ADD CONSTRAINT ck_sales_order_lines_flow CHECK (qty_backordered >= 0 AND qty_cancelled >= 0 AND qty_handed_over <= qty_picked AND qty_picked + qty_cancelled <= qty)`)
    await q.query(`ALTER TABLE sales_orders ADD COLUMN ready_at DATETIME NULL, ADD COLUMN ready_mailed_at DATETIME NULL, ADD COLUMN closed_at DATETIME NULL`)
    await q.query('ALTER TABLE outbox_messages ADD COLUMN sales_order_id INT NULL, ADD KEY ix_outbox_sales_order (sales_order_id)')
    await q.query(`CREATE TABLE handover_tickets (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      number VARCHAR(20) NULL,
      sales_order_id INT NOT NULL,
      kind VARCHAR(10) NOT NULL DEFAULT 'pickup',
      status VARCHAR(10) NOT NULL DEFAULT 'open',
      deliver_to VARCHAR(300) NULL,
      note VARCHAR(200) NULL,
      signer_name VARCHAR(100) NULL,
      signature_png MEDIUMBLOB NULL,
      signed_by INT NULL,
      signed_at DATETIME NULL,
      voided_by INT NULL,
      voided_at DATETIME NULL,
      created_by INT NULL,
      created_at DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
      updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
      UNIQUE KEY uq_handover_tickets_number (number),
      KEY ix_handover_tickets_order (sales_order_id),
      KEY ix_handover_tickets_status (status, created_at),
      CONSTRAINT fk_handover_tickets_order FOREIGN KEY (sales_order_id) REFERENCES sales_orders(id),
      CONSTRAINT ck_handover_tickets_kind CHECK (kind IN ('pickup', 'delivery')),
      CONSTRAINT ck_handover_tickets_status CHECK (status IN ('open', 'signed', 'voided'))
    ) ${TABLE}`)
    await q.query(`CREATE TABLE handover_ticket_lines (
      id INT NOT NULL AUTO_INCREMENT PRIMARY KEY,
      ticket_id INT NOT NULL,
      sales_order_line_id INT NOT NULL,
      item_id INT NOT NULL,
      bin_id INT NOT NULL,
      lot_id INT NULL,
      qty INT NOT NULL,
      move_id BIGINT NULL,
      KEY ix_handover_lines_ticket (ticket_id),
      KEY ix_handover_lines_sales_line (sales_order_line_id),
      CONSTRAINT fk_handover_lines_ticket FOREIGN KEY (ticket_id) REFERENCES handover_tickets(id) ON DELETE CASCADE,
      CONSTRAINT fk_handover_lines_sales_line FOREIGN KEY (sales_order_line_id) REFERENCES sales_order_lines(id),
      CONSTRAINT fk_handover_lines_item FOREIGN KEY (item_id) REFERENCES items(id),
      CONSTRAINT fk_handover_lines_bin FOREIGN KEY (bin_id) REFERENCES bins(id),
      CONSTRAINT ck_handover_lines_qty CHECK (qty > 0)
    ) ${TABLE}`)
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE handover_ticket_lines')
    await q.query('DROP TABLE handover_tickets')
    await q.query('ALTER TABLE outbox_messages DROP KEY ix_outbox_sales_order, DROP COLUMN sales_order_id')
    await q.query('ALTER TABLE sales_orders DROP COLUMN ready_at, DROP COLUMN ready_mailed_at, DROP COLUMN closed_at')
    await q.query('ALTER TABLE sales_order_lines DROP CONSTRAINT ck_sales_order_lines_flow, DROP COLUMN qty_backordered, DROP COLUMN qty_cancelled')
    await q.query('ALTER TABLE pick_shortages MODIFY bom_line_id INT NOT NULL')
    await q.query('ALTER TABLE pick_list_lines DROP FOREIGN KEY fk_pick_lines_sales_line, DROP COLUMN sales_order_line_id, MODIFY bom_line_id INT NOT NULL')
    await q.query(`ALTER TABLE pick_lists DROP CONSTRAINT ck_pick_lists_source, DROP FOREIGN KEY fk_pick_lists_sales_order,
      DROP KEY ix_pick_lists_sales_order, DROP COLUMN sales_order_id, MODIFY bom_id INT NOT NULL, MODIFY job_id INT NOT NULL`)
  }
}
