import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** Stock held for a document line (a pick list line). A balance's reserved = the sum of its reservations. */
@Entity({ name: 'stock_reservations' })
export class StockReservation {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'balance_id', type: 'int' }) balanceId: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'doc_type', type: 'varchar', length: 20 }) docType: string
  @Column({ name: 'doc_id', type: 'int' }) docId: number
  @Column({ name: 'doc_line_id', type: 'int', nullable: true }) docLineId: number | null
  @Column({ name: 'user_id', type: 'int', nullable: true }) userId: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}
