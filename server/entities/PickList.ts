import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { PickListStatus, ShortageAction, ShortReason } from '../../shared/schemas/picking.js'

/** Stock to pick for a job's bill of materials in one warehouse. Its reservations carry doc_type 'pick_list'. */
@Entity({ name: 'pick_lists' })
export class PickList {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** The bill of materials picked from; null when the list comes from a sales order. */
  @Column({ name: 'bom_id', type: 'int', nullable: true }) bomId: number | null
  @Column({ name: 'job_id', type: 'int', nullable: true }) jobId: number | null
  /** The sales order whose held lines this list picks (its picked units stay held for the order's handover ticket). */
  @Column({ name: 'sales_order_id', type: 'int', nullable: true }) salesOrderId: number | null
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ type: 'varchar', length: 12, default: 'draft' }) status: PickListStatus
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @Column({ name: 'released_by', type: 'int', nullable: true }) releasedBy: number | null
  @Column({ name: 'released_at', type: 'datetime', nullable: true }) releasedAt: Date | null
  @Column({ name: 'started_by', type: 'int', nullable: true }) startedBy: number | null
  @Column({ name: 'started_at', type: 'datetime', nullable: true }) startedAt: Date | null
  @Column({ name: 'picked_by', type: 'int', nullable: true }) pickedBy: number | null
  @Column({ name: 'picked_at', type: 'datetime', nullable: true }) pickedAt: Date | null
  @Column({ name: 'cancelled_by', type: 'int', nullable: true }) cancelledBy: number | null
  @Column({ name: 'cancelled_at', type: 'datetime', nullable: true }) cancelledAt: Date | null
  @Column({ name: 'cancel_reason', type: 'varchar', length: 200, nullable: true }) cancelReason: string | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime', precision: 3 }) updatedAt: Date
}

/** One bin and lot to take from; reserved under doc_line_id = this id. */
@Entity({ name: 'pick_list_lines' })
export class PickListLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'pick_list_id', type: 'int' }) pickListId: number
  @Column({ name: 'bom_line_id', type: 'int', nullable: true }) bomLineId: number | null
  @Column({ name: 'sales_order_line_id', type: 'int', nullable: true }) salesOrderLineId: number | null
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  /** The bill of materials' item this line stands in for, when it is a substitute. */
  @Column({ name: 'substitute_for_item_id', type: 'int', nullable: true }) substituteForItemId: number | null
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'confirmed_qty', type: 'int', default: 0 }) confirmedQty: number
  @Column({ name: 'short_qty', type: 'int', default: 0 }) shortQty: number
  @Column({ name: 'issued_qty', type: 'int', default: 0 }) issuedQty: number
}

/** One scanner confirmation (bin → item/lot → quantity); issued as a ledger move when the list completes. */
@Entity({ name: 'pick_confirmations' })
export class PickConfirmation {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'pick_list_id', type: 'int' }) pickListId: number
  @Column({ name: 'line_id', type: 'int' }) lineId: number
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'short_qty', type: 'int', default: 0 }) shortQty: number
  @Column({ name: 'short_reason', type: 'varchar', length: 20, nullable: true }) shortReason: ShortReason | null
  /** The Idempotency-Key the handheld made with the confirmation: a retry finds it instead of adding another. */
  @Column({ name: 'client_key', type: 'varchar', length: 100 }) clientKey: string
  @Column({ name: 'bin_scan', type: 'varchar', length: 200 }) binScan: string
  @Column({ name: 'item_scan', type: 'varchar', length: 200, nullable: true }) itemScan: string | null
  @Column({ name: 'lot_scan', type: 'varchar', length: 200, nullable: true }) lotScan: string | null
  @Column({ name: 'scanned_at', type: 'datetime', precision: 3, nullable: true }) scannedAt: Date | null
  @Column({ name: 'confirmed_by', type: 'int', nullable: true }) confirmedBy: number | null
  @CreateDateColumn({ name: 'confirmed_at', type: 'datetime', precision: 3 }) confirmedAt: Date
  @Column({ name: 'move_id', type: 'bigint', nullable: true }) moveId: string | null
  @Column({ name: 'issued_at', type: 'datetime', nullable: true }) issuedAt: Date | null
}

/** What a warehouse lacked when the list was made, and what the counter chose to do about it. */
@Entity({ name: 'pick_shortages' })
export class PickShortage {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'pick_list_id', type: 'int' }) pickListId: number
  @Column({ name: 'bom_line_id', type: 'int', nullable: true }) bomLineId: number | null
  /** The line closed short that this row resolves (a backorder or substitute chosen after picking). */
  @Column({ name: 'pick_list_line_id', type: 'int', nullable: true }) pickListLineId: number | null
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ type: 'int' }) qty: number
  @Column({ type: 'varchar', length: 12 }) action: ShortageAction
  @Column({ name: 'suggestion_id', type: 'int', nullable: true }) suggestionId: number | null
  @Column({ name: 'substitute_item_id', type: 'int', nullable: true }) substituteItemId: number | null
  @Column({ name: 'from_warehouse_id', type: 'int', nullable: true }) fromWarehouseId: number | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}

/** Stock another warehouse holds for this list (reserved there, doc_type 'pick_transfer') until shipped. */
@Entity({ name: 'pick_transfer_proposals' })
export class PickTransferProposal {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'pick_list_id', type: 'int' }) pickListId: number
  @Column({ name: 'bom_line_id', type: 'int' }) bomLineId: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ name: 'from_warehouse_id', type: 'int' }) fromWarehouseId: number
  @Column({ name: 'from_bin_id', type: 'int' }) fromBinId: number
  @Column({ name: 'to_warehouse_id', type: 'int' }) toWarehouseId: number
  @Column({ type: 'int' }) qty: number
  @Column({ type: 'varchar', length: 12, default: 'proposed' }) status: 'proposed' | 'shipped' | 'cancelled'
  @Column({ name: 'transfer_id', type: 'int', nullable: true }) transferId: number | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @Column({ name: 'shipped_by', type: 'int', nullable: true }) shippedBy: number | null
  @Column({ name: 'shipped_at', type: 'datetime', nullable: true }) shippedAt: Date | null
}
