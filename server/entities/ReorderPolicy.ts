import { Column, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'

export type PolicyScope = 'global' | 'family' | 'abc' | 'item_warehouse'

/**
 * One layer of reorder settings. Layers merge global → family → ABC class → item in a warehouse; a NULL field
 * inherits from the layer before it. scope_key makes each target unique: '' (global), the family, the class,
 * or 'item:warehouse'. Decimal columns come back as strings.
 */
@Entity({ name: 'reorder_policies' })
export class ReorderPolicyRow {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ type: 'varchar', length: 16 }) scope: PolicyScope
  @Column({ name: 'scope_key', type: 'varchar', length: 40 }) scopeKey: string
  @Column({ type: 'varchar', length: 20, nullable: true }) family: string | null
  @Column({ name: 'abc_class', type: 'char', length: 1, nullable: true }) abcClass: 'A' | 'B' | 'C' | null
  @Column({ name: 'item_id', type: 'int', nullable: true }) itemId: number | null
  @Column({ name: 'warehouse_id', type: 'int', nullable: true }) warehouseId: number | null
  @Column({ name: 'service_level', type: 'decimal', precision: 5, scale: 4, nullable: true }) serviceLevel: string | null
  @Column({ name: 'review_period_days', type: 'int', nullable: true }) reviewPeriodDays: number | null
  @Column({ name: 'cost_per_order', type: 'decimal', precision: 12, scale: 2, nullable: true }) costPerOrder: string | null
  @Column({ name: 'holding_rate', type: 'decimal', precision: 5, scale: 4, nullable: true }) holdingRate: string | null
  @Column({ type: 'varchar', length: 10, nullable: true }) method: 'eoq' | 'orderUpTo' | null
  @Column({ name: 'soon_days', type: 'int', nullable: true }) soonDays: number | null
  @Column({ name: 'overstock_margin_days', type: 'int', nullable: true }) overstockMarginDays: number | null
  @Column({ name: 'dead_stock_days', type: 'int', nullable: true }) deadStockDays: number | null
  /** Global layer only: days of usage history the statistics look at. */
  @Column({ name: 'usage_window_days', type: 'int', nullable: true }) usageWindowDays: number | null
  /** Global layer only: cumulative value shares that end class A and class B. */
  @Column({ name: 'abc_cutoff_a', type: 'decimal', precision: 5, scale: 4, nullable: true }) abcCutoffA: string | null
  @Column({ name: 'abc_cutoff_b', type: 'decimal', precision: 5, scale: 4, nullable: true }) abcCutoffB: string | null
  /** Item-in-warehouse layer only, and only with a reason. */
  @Column({ name: 'override_reorder_point', type: 'int', nullable: true }) overrideReorderPoint: number | null
  @Column({ name: 'override_order_qty', type: 'int', nullable: true }) overrideOrderQty: number | null
  @Column({ name: 'override_reason', type: 'varchar', length: 200, nullable: true }) overrideReason: string | null
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  @Column({ name: 'updated_by', type: 'int', nullable: true }) updatedBy: number | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}
