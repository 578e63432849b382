import { Column, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'

/**
 * On hand and reserved per item, bin and lot. Written only by the stock service, in the same
 * transaction as the ledger moves (on hand) or reservations (reserved) that explain it.
 * Unique on (item, bin, lot) through the generated column lot_key = IFNULL(lot_id, 0).
 */
@Entity({ name: 'stock_balances' })
export class StockBalance {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ name: 'on_hand', type: 'int', default: 0 }) onHand: number
  @Column({ type: 'int', default: 0 }) reserved: number
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}
