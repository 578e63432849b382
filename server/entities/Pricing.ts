import { Column, CreateDateColumn, Entity, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { PriceBasis } from '../../shared/pricing/sellingPrice.js'

/** A price level for contractor accounts (retail, contractor, volume …): a percentage off list for every item. */
@Entity({ name: 'price_levels' })
export class PriceLevel {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ type: 'varchar', length: 20, unique: true }) code: string
  @Column({ type: 'varchar', length: 80 }) name: string
  @Column({ name: 'percent_off', type: 'decimal', precision: 5, scale: 2, nullable: true }) percentOff: string | null
  @Column({ type: 'boolean', default: true }) active: boolean
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}

/** An item's price for a level (or every account, level null) from a quantity on: a set price or a percentage off list. */
@Entity({ name: 'price_rules' })
export class PriceRuleRow {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'level_id', type: 'int', nullable: true }) levelId: number | null
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'min_qty', type: 'int', default: 1 }) minQty: number
  @Column({ type: 'varchar', length: 4, default: 'unit' }) basis: PriceBasis
  @Column({ type: 'decimal', precision: 12, scale: 2, nullable: true }) price: string | null
  @Column({ name: 'percent_off', type: 'decimal', precision: 5, scale: 2, nullable: true }) percentOff: string | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}

/** The sales tax rate where a warehouse hands goods over. */
@Entity({ name: 'sales_tax_rates' })
export class SalesTaxRate {
  @PrimaryColumn({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'rate_percent', type: 'decimal', precision: 7, scale: 4 }) ratePercent: string
  @Column({ type: 'varchar', length: 80, nullable: true }) label: string | null
  @Column({ name: 'updated_by', type: 'int', nullable: true }) updatedBy: number | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}

/** A contractor account's selling terms: its price level and tax-exemption certificate. */
@Entity({ name: 'customer_terms' })
export class CustomerTerms {
  @PrimaryColumn({ name: 'customer_id', type: 'int' }) customerId: number
  @Column({ name: 'price_level_id', type: 'int', nullable: true }) priceLevelId: number | null
  @Column({ name: 'exempt_certificate', type: 'varchar', length: 40, nullable: true }) exemptCertificate: string | null
  @Column({ name: 'exempt_until', type: 'date', nullable: true }) exemptUntil: string | null
  @Column({ name: 'updated_by', type: 'int', nullable: true }) updatedBy: number | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}
