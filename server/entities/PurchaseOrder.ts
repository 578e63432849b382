import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

export type PurchaseOrderStatus = 'draft' | 'approved' | 'sent' | 'partly_received' | 'received' | 'closed' | 'cancelled'
/** Statuses whose unreceived quantities count as on order in the reorder position. */
export const OPEN_PO_STATUSES: PurchaseOrderStatus[] = ['approved', 'sent', 'partly_received']

@Entity({ name: 'purchase_orders' })
export class PurchaseOrder {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ type: 'varchar', length: 20, unique: true }) number: string
  @Column({ name: 'vendor_id', type: 'int' }) vendorId: number
  /** Ship-to warehouse. */
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'job_id', type: 'int', nullable: true }) jobId: number | null
  @Column({ type: 'varchar', length: 16, default: 'draft' }) status: PurchaseOrderStatus
  @Column({ type: 'char', length: 3, default: 'USD' }) currency: string
  @Column({ name: 'expected_date', type: 'date', nullable: true }) expectedDate: string | null
  @Column({ type: 'text', nullable: true }) notes: string | null
  @Column({ type: 'decimal', precision: 14, scale: 2, default: '0' }) total: string
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @Column({ name: 'approved_by', type: 'int', nullable: true }) approvedBy: number | null
  @Column({ name: 'approved_at', type: 'datetime', nullable: true }) approvedAt: Date | null
  @Column({ name: 'sent_by', type: 'int', nullable: true }) sentBy: number | null
  @Column({ name: 'sent_at', type: 'datetime', nullable: true }) sentAt: Date | null
  @Column({ name: 'closed_at', type: 'datetime', nullable: true }) closedAt: Date | null
  @Column({ name: 'cancelled_by', type: 'int', nullable: true }) cancelledBy: number | null
  @Column({ name: 'cancelled_at', type: 'datetime', nullable: true }) cancelledAt: Date | null
  @Column({ name: 'received_by', type: 'int', nullable: true }) receivedBy: number | null
  @Column({ name: 'received_at', type: 'datetime', nullable: true }) receivedAt: Date | null
  @Column({ name: 'closed_by', type: 'int', nullable: true }) closedBy: number | null
  @Column({ name: 'close_reason', type: 'varchar', length: 200, nullable: true }) closeReason: string | null
  @Column({ name: 'cancel_reason', type: 'varchar', length: 200, nullable: true }) cancelReason: string | null
  /** The last e-mail attempt's error; cleared by a send that works. */
  @Column({ name: 'send_error', type: 'varchar', length: 500, nullable: true }) sendError: string | null
  /** Goes up with every change; an edit or approval made on an older version is refused. */
  @Column({ type: 'int', default: 1 }) version: number
}

/** Ordered in purchase packs; qty_ordered = packs_ordered × pack_qty stock units. */
@Entity({ name: 'purchase_order_lines' })
export class PurchaseOrderLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'po_id', type: 'int' }) poId: number
  @Column({ name: 'line_no', type: 'int' }) lineNo: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'vendor_sku', type: 'varchar', length: 40, nullable: true }) vendorSku: string | null
  @Column({ type: 'varchar', length: 200 }) description: string
  @Column({ name: 'pack_qty', type: 'int', default: 1 }) packQty: number
  @Column({ name: 'packs_ordered', type: 'int' }) packsOrdered: number
  @Column({ name: 'qty_ordered', type: 'int' }) qtyOrdered: number
  @Column({ name: 'qty_received', type: 'int', default: 0 }) qtyReceived: number
  /** Arrived damaged and refused: not in stock, still owed by the vendor. */
  @Column({ name: 'qty_damaged', type: 'int', default: 0 }) qtyDamaged: number
  /** Per stock unit. */
  @Column({ name: 'unit_cost', type: 'decimal', precision: 12, scale: 4 }) unitCost: string
  @Column({ name: 'bom_line_id', type: 'int', nullable: true }) bomLineId: number | null
  @Column({ name: 'spec_json', type: 'text', nullable: true }) specJson: string | null
}

/** A reorder suggestion the buyer accepted (or a special order), waiting to become a PO line. */
@Entity({ name: 'purchase_suggestions' })
export class PurchaseSuggestion {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'vendor_id', type: 'int', nullable: true }) vendorId: number | null
  @Column({ type: 'int' }) qty: number
  @Column({ type: 'varchar', length: 12, default: 'accepted' }) status: 'accepted' | 'ordered' | 'dismissed'
  /** 'reorder' (from the suggestion list) or 'backorder' (a pick list shortage). */
  @Column({ type: 'varchar', length: 12, default: 'reorder' }) source: 'reorder' | 'backorder'
  @Column({ name: 'po_line_id', type: 'int', nullable: true }) poLineId: number | null
  @Column({ type: 'mediumtext', nullable: true }) explanation: string | null
  @Column({ name: 'accepted_by', type: 'int', nullable: true }) acceptedBy: number | null
  @CreateDateColumn({ name: 'accepted_at', type: 'datetime' }) acceptedAt: Date
}
