import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { HandoverKind, HandoverStatus } from '../../shared/sales/handoverTerms.js'

/** What leaves a sales order at once, picked up at the counter or delivered; signed on a tablet, then its stock is issued. */
@Entity({ name: 'handover_tickets' })
export class HandoverTicket {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ type: 'varchar', length: 20, nullable: true }) number: string | null
  @Column({ name: 'sales_order_id', type: 'int' }) salesOrderId: number
  @Column({ type: 'varchar', length: 10, default: 'pickup' }) kind: HandoverKind
  @Column({ type: 'varchar', length: 10, default: 'open' }) status: HandoverStatus
  @Column({ name: 'deliver_to', type: 'varchar', length: 300, nullable: true }) deliverTo: string | null
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  @Column({ name: 'signer_name', type: 'varchar', length: 100, nullable: true }) signerName: string | null
  @Column({ name: 'signature_png', type: 'mediumblob', nullable: true, select: false }) signaturePng: Buffer | null
  @Column({ name: 'signed_by', type: 'int', nullable: true }) signedBy: number | null
  @Column({ name: 'signed_at', type: 'datetime', nullable: true }) signedAt: Date | null
  @Column({ name: 'voided_by', type: 'int', nullable: true }) voidedBy: number | null
  @Column({ name: 'voided_at', type: 'datetime', nullable: true }) voidedAt: Date | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime', precision: 3 }) updatedAt: Date
}

/** One bin and lot of an order line on a ticket; move_id is the stock move that issued it. */
@Entity({ name: 'handover_ticket_lines' })
export class HandoverTicketLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'ticket_id', type: 'int' }) ticketId: number
  @Column({ name: 'sales_order_line_id', type: 'int' }) salesOrderLineId: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'move_id', type: 'bigint', nullable: true }) moveId: string | null
}
