import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { QuoteStatus } from '../../shared/sales/quoteStatus.js'

/** A quote to a contractor: one row per revision of a quote number; older revisions are kept as they were. */
@Entity({ name: 'quotes' })
export class Quote {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ type: 'varchar', length: 20, nullable: true }) number: string | null
  @Column({ type: 'int', default: 1 }) revision: number
  @Column({ type: 'varchar', length: 10, default: 'draft' }) status: QuoteStatus
  @Column({ name: 'customer_id', type: 'int' }) customerId: number
  @Column({ name: 'job_id', type: 'int', nullable: true }) jobId: number | null
  @Column({ name: 'bom_id', type: 'int', nullable: true }) bomId: number | null
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'quoted_on', type: 'date' }) quotedOn: string
  @Column({ name: 'valid_until', type: 'date' }) validUntil: string
  @Column({ name: 'price_level_code', type: 'varchar', length: 20, nullable: true }) priceLevelCode: string | null
  @Column({ type: 'decimal', precision: 14, scale: 2, default: '0' }) subtotal: string
  @Column({ name: 'tax_rate', type: 'decimal', precision: 7, scale: 4, default: '0' }) taxRate: string
  @Column({ name: 'tax_amount', type: 'decimal', precision: 14, scale: 2, default: '0' }) taxAmount: string
  @Column({ name: 'tax_json', type: 'text', nullable: true }) taxJson: string | null
  @Column({ name: 'amount_due', type: 'decimal', precision: 14, scale: 2, default: '0' }) amountDue: string
  @Column({ type: 'text', nullable: true }) terms: string | null
  @Column({ type: 'text', nullable: true }) notes: string | null
  @Column({ name: 'lost_reason', type: 'varchar', length: 200, nullable: true }) lostReason: string | null
  @Column({ name: 'offered_at', type: 'datetime', nullable: true }) offeredAt: Date | null
  @Column({ name: 'taken_at', type: 'datetime', nullable: true }) takenAt: Date | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}

@Entity({ name: 'quote_lines' })
export class QuoteLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'quote_id', type: 'int' }) quoteId: number
  @Column({ name: 'line_no', type: 'int' }) lineNo: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'bom_line_id', type: 'int', nullable: true }) bomLineId: number | null
  @Column({ type: 'varchar', length: 200 }) description: string
  @Column({ name: 'asked_qty', type: 'int' }) askedQty: number
  @Column({ type: 'int' }) qty: number
  @Column({ type: 'int', nullable: true }) packs: number | null
  @Column({ name: 'pack_size', type: 'int', default: 1 }) packSize: number
  @Column({ name: 'unit_price', type: 'decimal', precision: 14, scale: 4 }) unitPrice: string
  @Column({ name: 'pack_price', type: 'decimal', precision: 14, scale: 2, nullable: true }) packPrice: string | null
  @Column({ type: 'decimal', precision: 14, scale: 2 }) extension: string
  @Column({ name: 'price_source', type: 'varchar', length: 10 }) priceSource: string
  @Column({ name: 'explanation_json', type: 'text' }) explanationJson: string
  @Column({ name: 'override_price', type: 'decimal', precision: 12, scale: 2, nullable: true }) overridePrice: string | null
  @Column({ name: 'override_reason', type: 'varchar', length: 200, nullable: true }) overrideReason: string | null
  @Column({ name: 'made_to_order', type: 'boolean', default: false }) madeToOrder: boolean
}
