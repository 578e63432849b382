import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm'

/** A request carrying an Idempotency-Key: its hash and answer, stored in the transaction of its effect. */
@Entity({ name: 'idempotency_records' })
export class IdempotencyRecord {
  @PrimaryColumn({ name: 'user_id', type: 'int' }) userId: number
  @PrimaryColumn({ name: 'idem_key', type: 'varchar', length: 100 }) key: string
  @Column({ type: 'varchar', length: 120 }) scope: string
  @Column({ name: 'request_hash', type: 'char', length: 64 }) requestHash: string
  @Column({ name: 'response_status', type: 'int' }) responseStatus: number
  @Column({ name: 'response_body', type: 'mediumtext' }) responseBody: string
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}
