import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'
import type { MoveType } from '../../shared/catalog.js'

/** The append-only stock ledger: the sum of a balance's moves is its on-hand quantity. */
@Entity({ name: 'stock_moves' })
export class StockMove {
  @PrimaryGeneratedColumn({ type: 'bigint' }) id: string
  @Column({ type: 'datetime', precision: 3 }) at: Date
  @Column({ name: 'move_type', type: 'varchar', length: 16 }) moveType: MoveType
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  /** Signed, in stock units: + into the bin, − out of it. */
  @Column({ type: 'int' }) qty: number
  @Column({ name: 'unit_cost', type: 'decimal', precision: 12, scale: 4, nullable: true }) unitCost: string | null
  /** The document the move belongs to (pick_list, purchase_order, transfer, count, …). */
  @Column({ name: 'doc_type', type: 'varchar', length: 20, nullable: true }) docType: string | null
  @Column({ name: 'doc_id', type: 'int', nullable: true }) docId: number | null
  @Column({ name: 'doc_line_id', type: 'int', nullable: true }) docLineId: number | null
  @Column({ type: 'varchar', length: 20, nullable: true }) reason: string | null
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  /** Moves written by one operation share a batch id. */
  @Column({ name: 'batch_id', type: 'char', length: 36 }) batchId: string
  @Column({ name: 'user_id', type: 'int', nullable: true }) userId: number | null
}
