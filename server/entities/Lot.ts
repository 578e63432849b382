import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

/** A production run of an item. Blocks from different runs can differ in tint. */
@Entity({ name: 'lots' })
@Index(['itemId', 'code'], { unique: true })
export class Lot {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ type: 'varchar', length: 20 }) code: string
  @Column({ name: 'received_at', type: 'date' }) receivedAt: string
  @Column({ name: 'vendor_id', type: 'int', nullable: true }) vendorId: number | null
  @Column({ name: 'tint_note', type: 'varchar', length: 120, nullable: true }) tintNote: string | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}
