import { Column, Entity, PrimaryColumn } from 'typeorm'

/** The last word from one handheld about its outbox: confirmations still waiting to go out, and refused ones. */
@Entity({ name: 'device_outbox_reports' })
export class DeviceOutboxReport {
  @PrimaryColumn({ name: 'device_id', type: 'varchar', length: 64 }) deviceId: string
  @Column({ name: 'user_id', type: 'int', nullable: true }) userId: number | null
  @Column({ name: 'warehouse_id', type: 'int', nullable: true }) warehouseId: number | null
  @Column({ type: 'int', default: 0 }) waiting: number
  @Column({ type: 'int', default: 0 }) refused: number
  @Column({ name: 'oldest_waiting_at', type: 'datetime', precision: 3, nullable: true }) oldestWaitingAt: Date | null
  @Column({ name: 'reported_at', type: 'datetime', precision: 3 }) reportedAt: Date
}
