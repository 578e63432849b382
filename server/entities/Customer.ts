import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'

/** A contractor account. */
@Entity({ name: 'customers' })
export class Customer {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ type: 'varchar', length: 20, unique: true }) code: string
  @Column({ type: 'varchar', length: 120 }) name: string
  @Column({ name: 'contact_name', type: 'varchar', length: 80, nullable: true }) contactName: string | null
  @Column({ type: 'varchar', length: 120, nullable: true }) email: string | null
  @Column({ type: 'varchar', length: 40, nullable: true }) phone: string | null
  @Column({ type: 'varchar', length: 200, nullable: true }) address: string | null
  @Column({ type: 'text', nullable: true }) notes: string | null
  @Column({ type: 'boolean', default: true }) active: boolean
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}

export type JobStatus = 'open' | 'ordered' | 'picking' | 'complete' | 'cancelled'

@Entity({ name: 'jobs' })
export class Job {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ name: 'customer_id', type: 'int' }) customerId: number
  @Column({ type: 'varchar', length: 120 }) name: string
  @Column({ name: 'site_address', type: 'varchar', length: 200, nullable: true }) siteAddress: string | null
  @Column({ type: 'varchar', length: 12, default: 'open' }) status: JobStatus
  @Column({ name: 'due_date', type: 'date', nullable: true }) dueDate: string | null
  @Column({ type: 'text', nullable: true }) notes: string | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}

/** A contractor's takeoff as entered: the JSON of shared/schemas/takeoff.ts. */
@Entity({ name: 'takeoffs' })
export class Takeoff {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  /** Goes up with every save; a save made on an older version is refused (server/services/editVersion.ts). */
  @Column({ type: 'int', default: 1 }) version: number
  @Column({ name: 'job_id', type: 'int' }) jobId: number
  @Column({ type: 'varchar', length: 120 }) name: string
  @Column({ name: 'input_json', type: 'mediumtext' }) inputJson: string
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}
