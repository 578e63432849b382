import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

@Entity({ name: 'vendors' })
export class Vendor {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ type: 'varchar', length: 20, unique: true }) code: string
  @Column({ type: 'varchar', length: 120 }) name: string
  @Column({ name: 'contact_name', type: 'varchar', length: 80, nullable: true }) contactName: string | null
  @Column({ type: 'varchar', length: 120, nullable: true }) email: string | null
  @Column({ type: 'varchar', length: 40, nullable: true }) phone: string | null
  @Column({ type: 'varchar', length: 200, nullable: true }) address: string | null
  /** Payment terms in the vendor's words, e.g. "Net 30". */
  @Column({ type: 'varchar', length: 40, nullable: true }) terms: string | null
  @Column({ type: 'char', length: 3, default: 'USD' }) currency: string
  @Column({ name: 'lead_time_days', type: 'int', default: 14 }) leadTimeDays: number
  @Column({ type: 'boolean', default: true }) active: boolean
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}

/** What a vendor sells us: their SKU, purchase pack, minimum order, cost and lead time. */
@Entity({ name: 'vendor_items' })
@Index(['vendorId', 'itemId'], { unique: true })
export class VendorItem {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ name: 'vendor_id', type: 'int' }) vendorId: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'vendor_sku', type: 'varchar', length: 40 }) vendorSku: string
  /** Stock units per purchase pack. */
  @Column({ name: 'pack_qty', type: 'int', default: 1 }) packQty: number
  /** Minimum order in stock units. */
  @Column({ name: 'min_order_qty', type: 'int', default: 1 }) minOrderQty: number
  @Column({ name: 'unit_cost', type: 'decimal', precision: 12, scale: 4 }) unitCost: string
  @Column({ name: 'lead_time_days', type: 'int', nullable: true }) leadTimeDays: number | null
  /** The vendor we order this item from by default. */
  @Column({ type: 'boolean', default: false }) preferred: boolean
}
