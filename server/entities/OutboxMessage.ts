import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** Every e-mail the app tried to send, with its attachments, whatever SMTP server took (or refused) it. */
@Entity({ name: 'outbox_messages' })
export class OutboxMessage {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'created_at', type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date
  @Column({ name: 'sent_at', type: 'datetime', precision: 3, nullable: true }) sentAt: Date | null
  @Column({ type: 'varchar', length: 8 }) status: 'sent' | 'failed'
  @Column({ name: 'from_address', type: 'varchar', length: 200 }) fromAddress: string
  @Column({ name: 'to_address', type: 'varchar', length: 300 }) toAddress: string
  /** Comma-separated copies. */
  @Column({ type: 'varchar', length: 700, nullable: true }) cc: string | null
  /** Where the vendor's answer goes (Reply-To). */
  @Column({ name: 'reply_to', type: 'varchar', length: 254, nullable: true }) replyTo: string | null
  @Column({ type: 'varchar', length: 200 }) subject: string
  @Column({ name: 'body_text', type: 'text' }) bodyText: string
  @Column({ type: 'varchar', length: 500, nullable: true }) error: string | null
  @Column({ name: 'message_id', type: 'varchar', length: 200, nullable: true }) messageId: string | null
  @Column({ name: 'po_id', type: 'int', nullable: true }) poId: number | null
  /** A quote e-mailed to a contractor (counter sales). */
  @Column({ name: 'quote_id', type: 'int', nullable: true }) quoteId: number | null
  /** A sales order's notice to the contractor (ready to collect). */
  @Column({ name: 'sales_order_id', type: 'int', nullable: true }) salesOrderId: number | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  /** The failed message this one sends again (each failed message is sent again at most once). */
  @Column({ name: 'retry_of', type: 'int', nullable: true }) retryOf: number | null
}

@Entity({ name: 'outbox_attachments' })
export class OutboxAttachment {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'message_id', type: 'int' }) messageId: number
  @Column({ type: 'varchar', length: 120 }) name: string
  @Column({ name: 'content_type', type: 'varchar', length: 100 }) contentType: string
  @Column({ type: 'mediumblob', select: false }) bytes: Buffer
}
