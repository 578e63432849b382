import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'
import type { Role } from '../../shared/roles.js'

/** Roles are stored as comma-separated text. */
export const rolesTransformer = {
  to: (roles: Role[] | undefined) => (roles ?? []).join(','),
  from: (text: string | null) => (text ? (text.split(',') as Role[]) : []),
}

@Entity({ name: 'users' })
export class User {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number

  @Column({ type: 'varchar', length: 40, unique: true })
  username: string

  @Column({ name: 'display_name', type: 'varchar', length: 80 })
  displayName: string

  @Column({ type: 'varchar', length: 120, nullable: true })
  email: string | null

  @Column({ name: 'password_hash', type: 'varchar', length: 100 })
  passwordHash: string

  @Column({ type: 'varchar', length: 100, transformer: rolesTransformer })
  roles: Role[]

  @Column({ type: 'boolean', default: true })
  active: boolean

  @Column({ name: 'unit_preference', type: 'varchar', length: 2, default: 'in' })
  unitPreference: 'in' | 'mm'

  @Column({ name: 'weight_unit', type: 'varchar', length: 2, default: 'lb' })
  weightUnit: 'lb' | 'kg'

  @Column({ type: 'varchar', length: 2, default: 'en' })
  locale: 'en' | 'es'

  /** Bumped when sessions must end: deactivation, password reset or change. */
  @Column({ name: 'session_epoch', type: 'int', default: 0 })
  sessionEpoch: number

  @Column({ name: 'last_sign_in_at', type: 'datetime', nullable: true })
  lastSignInAt: Date | null

  @CreateDateColumn({ name: 'created_at', type: 'datetime' })
  createdAt: Date

  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' })
  updatedAt: Date
}
