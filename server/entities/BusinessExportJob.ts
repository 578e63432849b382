import { Column, Entity, PrimaryColumn } from 'typeorm'

/** One everything-out export: how far it got, its file (kept in the database) while kept, who started it and when. */
@Entity({ name: 'business_export_jobs' })
export class BusinessExportJob {
  @PrimaryColumn({ type: 'char', length: 36 }) id: string
  @Column({ type: 'varchar', length: 10 }) state: 'running' | 'ready' | 'failed'
  /** 1 while running, else null: unique, so one export runs at a time across every app process. */
  @Column({ name: 'running_slot', type: 'tinyint', nullable: true }) runningSlot: number | null
  @Column({ name: 'rows_total', type: 'int', nullable: true }) rowsTotal: number | null
  @Column({ name: 'rows_done', type: 'int', default: 0 }) rowsDone: number
  @Column({ type: 'varchar', length: 120 }) filename: string
  /** The finished zip in stored_files (server/db/storedFiles.ts), which any app process serves. */
  @Column({ name: 'file_id', type: 'char', length: 36, nullable: true }) fileId: string | null
  @Column({ type: 'bigint', nullable: true }) bytes: string | null
  @Column({ name: 'user_id', type: 'int', nullable: true }) userId: number | null
  @Column({ name: 'started_at', type: 'datetime', precision: 3 }) startedAt: Date
  @Column({ name: 'heartbeat_at', type: 'datetime', precision: 3 }) heartbeatAt: Date
  @Column({ name: 'finished_at', type: 'datetime', precision: 3, nullable: true }) finishedAt: Date | null
  @Column({ name: 'expires_at', type: 'datetime', precision: 3, nullable: true }) expiresAt: Date | null
}
