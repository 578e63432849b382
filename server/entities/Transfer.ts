import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** Stock shipped from one warehouse to another: in transit until received. */
@Entity({ name: 'transfers' })
export class Transfer {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'from_warehouse_id', type: 'int' }) fromWarehouseId: number
  @Column({ name: 'to_warehouse_id', type: 'int' }) toWarehouseId: number
  @Column({ type: 'varchar', length: 12, default: 'in_transit' }) status: 'in_transit' | 'received' | 'cancelled'
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  @Column({ name: 'shipped_by', type: 'int', nullable: true }) shippedBy: number | null
  @CreateDateColumn({ name: 'shipped_at', type: 'datetime' }) shippedAt: Date
  @Column({ name: 'received_by', type: 'int', nullable: true }) receivedBy: number | null
  @Column({ name: 'received_at', type: 'datetime', nullable: true }) receivedAt: Date | null
}

@Entity({ name: 'transfer_lines' })
export class TransferLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'transfer_id', type: 'int' }) transferId: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ name: 'from_bin_id', type: 'int' }) fromBinId: number
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'received_qty', type: 'int', default: 0 }) receivedQty: number
}
