import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm'

/** An admin setting as key and text value; server/services/appSettings.ts knows the keys and types. */
@Entity({ name: 'app_settings' })
export class AppSetting {
  @PrimaryColumn({ name: 'setting_key', type: 'varchar', length: 60 }) key: string
  @Column({ type: 'varchar', length: 500 }) value: string
  @Column({ name: 'updated_by', type: 'int', nullable: true }) updatedBy: number | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}
