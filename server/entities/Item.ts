import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { ItemFamily, StockUnit, ThicknessClass } from '../../shared/catalog.js'

/** A catalog item. Decimal columns come back from MariaDB as strings (money, weights, sizes). */
@Entity({ name: 'items' })
export class Item {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ type: 'varchar', length: 40, unique: true }) sku: string
  @Column({ type: 'varchar', length: 120 }) name: string
  @Column({ type: 'varchar', length: 20 }) family: ItemFamily
  @Column({ name: 'stock_unit', type: 'varchar', length: 10 }) stockUnit: StockUnit
  /** Stock units per case / per pallet (integer multiples); null when not sold that way. */
  @Column({ name: 'case_qty', type: 'int', nullable: true }) caseQty: number | null
  @Column({ name: 'pallet_qty', type: 'int', nullable: true }) palletQty: number | null
  @Column({ name: 'sell_by_pack', type: 'boolean', default: false }) sellByPack: boolean
  @Column({ type: 'varchar', length: 14, nullable: true, unique: true }) gtin: string | null
  @Column({ name: 'weight_kg', type: 'decimal', precision: 10, scale: 3, default: '0' }) weightKg: string
  /** Standard cost per stock unit; the moving average per warehouse is in item_warehouses. */
  @Column({ type: 'decimal', precision: 12, scale: 4, default: '0' }) cost: string
  @Column({ name: 'list_price', type: 'decimal', precision: 12, scale: 2, default: '0' }) listPrice: string
  @Column({ type: 'boolean', default: true }) active: boolean
  /** Made to order (shower bases): never stocked, becomes a purchase line tied to the job. */
  @Column({ name: 'made_to_order', type: 'boolean', default: false }) madeToOrder: boolean
  /** Picked from one production lot per job where possible (blocks: tint varies between runs). */
  @Column({ name: 'match_lot', type: 'boolean', default: false }) matchLot: boolean

  // Glass block attributes
  @Column({ name: 'nominal_size', type: 'varchar', length: 16, nullable: true }) nominalSize: string | null
  @Column({ name: 'face_width_mm', type: 'decimal', precision: 8, scale: 2, nullable: true }) faceWidthMm: string | null
  @Column({ name: 'face_height_mm', type: 'decimal', precision: 8, scale: 2, nullable: true }) faceHeightMm: string | null
  @Column({ name: 'depth_mm', type: 'decimal', precision: 8, scale: 2, nullable: true }) depthMm: string | null
  @Column({ name: 'thickness_class', type: 'varchar', length: 10, nullable: true }) thicknessClass: ThicknessClass | null
  @Column({ type: 'varchar', length: 30, nullable: true }) pattern: string | null
  @Column({ type: 'varchar', length: 30, nullable: true }) shape: string | null

  // What the takeoff needs of consumables
  @Column({ name: 'cartridge_ml', type: 'decimal', precision: 8, scale: 2, nullable: true }) cartridgeMl: string | null
  @Column({ name: 'grout_yield_ml', type: 'decimal', precision: 10, scale: 2, nullable: true }) groutYieldMl: string | null
  @Column({ name: 'joint_mm', type: 'decimal', precision: 6, scale: 3, nullable: true }) jointMm: string | null

  @Column({ type: 'text', nullable: true }) description: string | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}
