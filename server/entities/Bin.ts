import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'
import type { BinKind } from '../../shared/catalog.js'

/** A storage location in a warehouse. Each warehouse also has one 'transit' bin for inbound transfers. */
@Entity({ name: 'bins' })
@Index(['warehouseId', 'code'], { unique: true })
export class Bin {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ type: 'varchar', length: 32 }) code: string
  @Column({ type: 'varchar', length: 12, default: 'storage' }) kind: BinKind
  @Column({ type: 'boolean', default: true }) active: boolean
}
