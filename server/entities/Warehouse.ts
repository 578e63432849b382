import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm'

@Entity({ name: 'warehouses' })
export class Warehouse {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ type: 'varchar', length: 12, unique: true }) code: string
  @Column({ type: 'varchar', length: 80 }) name: string
  @Column({ type: 'varchar', length: 200, nullable: true }) address: string | null
  /** Bin code pattern, a regular expression with named groups aisle, bay, level. */
  @Column({ name: 'bin_pattern', type: 'varchar', length: 120, default: '^(?<aisle>[A-Z]+)-(?<bay>\\d+)-(?<level>\\d+)$' }) binPattern: string
  /** Aisles in walking order, comma separated (empty: alphabetical). */
  @Column({ name: 'aisle_order', type: 'varchar', length: 200, default: '' }) aisleOrder: string
  @Column({ name: 'walk_direction', type: 'varchar', length: 12, default: 'serpentine' }) walkDirection: 'serpentine' | 'oneWay'
  @Column({ type: 'boolean', default: true }) active: boolean
}
