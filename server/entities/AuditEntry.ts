import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm'

/** Who did what, when: written in the same transaction as the change it records. */
@Entity({ name: 'audit_entries' })
@Index(['entity', 'entityId'])
export class AuditEntry {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string

  @Column({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  at: Date

  @Column({ name: 'user_id', type: 'int', nullable: true })
  userId: number | null

  @Column({ type: 'varchar', length: 60 })
  action: string

  @Column({ type: 'varchar', length: 40 })
  entity: string

  @Column({ name: 'entity_id', type: 'varchar', length: 40, nullable: true })
  entityId: string | null

  @Column({ type: 'text', nullable: true })
  detail: string | null

  @Column({ type: 'varchar', length: 45, nullable: true })
  ip: string | null
}
