import { Column, Entity, PrimaryColumn } from 'typeorm'

/** Per item and warehouse: moving-average unit cost and the manual minimum (low-stock flag). */
@Entity({ name: 'item_warehouses' })
export class ItemWarehouse {
  @PrimaryColumn({ name: 'item_id', type: 'int' }) itemId: number
  @PrimaryColumn({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'avg_cost', type: 'decimal', precision: 14, scale: 4, default: '0' }) avgCost: string
  @Column({ name: 'min_qty', type: 'int', nullable: true }) minQty: number | null
}
