import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { ReceiptVariance } from '../../shared/purchasing/receiptRules.js'

/** One posting of goods received against a purchase order (a PO can have several: partial receipts). */
@Entity({ name: 'po_receipts' })
export class PurchaseReceipt {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'po_id', type: 'int' }) poId: number
  @Column({ name: 'received_by', type: 'int', nullable: true }) receivedBy: number | null
  @Column({ name: 'received_at', type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) receivedAt: Date
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  /** The stock service's batch id of the receipt moves. */
  @Column({ name: 'batch_id', type: 'char', length: 36, nullable: true }) batchId: string | null
}

/** What arrived for one PO line into one bin and lot: good units (qty) and refused damaged units. */
@Entity({ name: 'po_receipt_lines' })
export class PurchaseReceiptLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'receipt_id', type: 'int' }) receiptId: number
  @Column({ name: 'po_line_id', type: 'int' }) poLineId: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'qty_damaged', type: 'int', default: 0 }) qtyDamaged: number
  @Column({ type: 'varchar', length: 10, nullable: true }) variance: ReceiptVariance | null
  @Column({ type: 'varchar', length: 200, nullable: true }) reason: string | null
  /** Made-to-order lines are issued straight to their job on receipt. */
  @Column({ name: 'issued_to_job_id', type: 'int', nullable: true }) issuedToJobId: number | null
}
