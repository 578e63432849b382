import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { PaymentMethod, PaymentStatus, SalesOrderStatus } from '../../shared/sales/salesOrderTerms.js'

/** What a contractor ordered by taking a quote: one order per quote row. Its holds (stock_reservations, not moves) carry its own doc type. */
@Entity({ name: 'sales_orders' })
export class SalesOrder {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ type: 'varchar', length: 20, nullable: true }) number: string | null
  @Column({ name: 'quote_id', type: 'int' }) quoteId: number
  @Column({ name: 'customer_id', type: 'int' }) customerId: number
  @Column({ name: 'job_id', type: 'int', nullable: true }) jobId: number | null
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ type: 'varchar', length: 12, default: 'booked' }) status: SalesOrderStatus
  @Column({ type: 'decimal', precision: 14, scale: 2, default: '0' }) subtotal: string
  @Column({ name: 'tax_amount', type: 'decimal', precision: 14, scale: 2, default: '0' }) taxAmount: string
  @Column({ type: 'decimal', precision: 14, scale: 2, default: '0' }) total: string
  @Column({ name: 'deposit_percent', type: 'decimal', precision: 5, scale: 2, default: '0' }) depositPercent: string
  @Column({ name: 'deposit_required', type: 'decimal', precision: 12, scale: 2, default: '0' }) depositRequired: string
  @Column({ name: 'deposit_paid', type: 'decimal', precision: 12, scale: 2, default: '0' }) depositPaid: string
  @Column({ name: 'cancel_reason', type: 'varchar', length: 200, nullable: true }) cancelReason: string | null
  @Column({ name: 'cancelled_by', type: 'int', nullable: true }) cancelledBy: number | null
  @Column({ name: 'cancelled_at', type: 'datetime', nullable: true }) cancelledAt: Date | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
  /** When a completed pick left goods waiting at the counter; the contractor is e-mailed once per time (ready_mailed_at). */
  @Column({ name: 'ready_at', type: 'datetime', nullable: true }) readyAt: Date | null
  @Column({ name: 'ready_mailed_at', type: 'datetime', nullable: true }) readyMailedAt: Date | null
  /** When every line was handed over or cancelled. */
  @Column({ name: 'closed_at', type: 'datetime', nullable: true }) closedAt: Date | null
}

/** One quoted line as ordered; stock lines are held under doc_line_id = this id, made-to-order lines point at their PO line. */
@Entity({ name: 'sales_order_lines' })
export class SalesOrderLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'sales_order_id', type: 'int' }) salesOrderId: number
  @Column({ name: 'line_no', type: 'int' }) lineNo: number
  @Column({ name: 'quote_line_id', type: 'int', nullable: true }) quoteLineId: number | null
  @Column({ name: 'bom_line_id', type: 'int', nullable: true }) bomLineId: number | null
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ type: 'varchar', length: 200 }) description: string
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'unit_price', type: 'decimal', precision: 14, scale: 4 }) unitPrice: string
  @Column({ type: 'decimal', precision: 14, scale: 2 }) extension: string
  @Column({ type: 'decimal', precision: 14, scale: 2, default: '0' }) tax: string
  @Column({ name: 'made_to_order', type: 'boolean', default: false }) madeToOrder: boolean
  @Column({ name: 'qty_reserved', type: 'int', default: 0 }) qtyReserved: number
  @Column({ name: 'qty_picked', type: 'int', default: 0 }) qtyPicked: number
  @Column({ name: 'qty_handed_over', type: 'int', default: 0 }) qtyHandedOver: number
  /** Stocked units a completed pick could not find, waiting for stock (a purchase suggestion was raised). */
  @Column({ name: 'qty_backordered', type: 'int', default: 0 }) qtyBackordered: number
  /** Units the counter took off the order (a backorder the contractor no longer wants). */
  @Column({ name: 'qty_cancelled', type: 'int', default: 0 }) qtyCancelled: number
  @Column({ name: 'qty_returned', type: 'int', default: 0 }) qtyReturned: number
  @Column({ name: 'po_line_id', type: 'int', nullable: true }) poLineId: number | null
}

/** Money received against an order: cash and cheque recorded by hand, card rows from the payment provider. */
@Entity({ name: 'payments' })
export class Payment {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'sales_order_id', type: 'int' }) salesOrderId: number
  @Column({ type: 'varchar', length: 8 }) method: PaymentMethod
  @Column({ type: 'decimal', precision: 12, scale: 2 }) amount: string
  @Column({ type: 'varchar', length: 12, default: 'settled' }) status: PaymentStatus
  /** The cheque number, or the provider's payment id. */
  @Column({ type: 'varchar', length: 100, nullable: true }) reference: string | null
  /** The provider's event that recorded it: unique, so a replayed event records nothing twice. */
  @Column({ name: 'provider_event_id', type: 'varchar', length: 100, nullable: true }) providerEventId: string | null
  @Column({ name: 'recorded_by', type: 'int', nullable: true }) recordedBy: number | null
  @CreateDateColumn({ name: 'recorded_at', type: 'datetime', precision: 3 }) recordedAt: Date
  @Column({ name: 'refunded_amount', type: 'decimal', precision: 12, scale: 2, default: '0' }) refundedAmount: string
}
