import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm'

/** A saved bill of materials of a job (each save is a new revision). */
@Entity({ name: 'boms' })
export class Bom {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'job_id', type: 'int' }) jobId: number
  @Column({ name: 'takeoff_id', type: 'int', nullable: true }) takeoffId: number | null
  @Column({ type: 'int', default: 1 }) revision: number
  @Column({ type: 'varchar', length: 12, default: 'saved' }) status: string
  @Column({ name: 'cautions_json', type: 'mediumtext', nullable: true }) cautionsJson: string | null
  @Column({ name: 'totals_json', type: 'text', nullable: true }) totalsJson: string | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @CreateDateColumn({ name: 'created_at', type: 'datetime' }) createdAt: Date
}

/**
 * One line of a bill of materials. Stocked lines have an item; made-to-order lines (shower bases)
 * carry their spec and become purchase lines. picked_qty and ordered_qty are kept by pick lists and
 * purchase orders.
 */
@Entity({ name: 'bom_lines' })
export class BomLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'bom_id', type: 'int' }) bomId: number
  @Column({ name: 'line_no', type: 'int' }) lineNo: number
  @Column({ name: 'item_id', type: 'int', nullable: true }) itemId: number | null
  @Column({ type: 'varchar', length: 20, nullable: true }) role: string | null
  @Column({ type: 'varchar', length: 40, nullable: true }) sku: string | null
  @Column({ type: 'varchar', length: 200 }) description: string
  @Column({ type: 'int' }) qty: number
  @Column({ type: 'varchar', length: 10 }) unit: string
  @Column({ name: 'made_to_order', type: 'boolean', default: false }) madeToOrder: boolean
  @Column({ name: 'spec_json', type: 'text', nullable: true }) specJson: string | null
  @Column({ name: 'explanation_json', type: 'mediumtext', nullable: true }) explanationJson: string | null
  @Column({ name: 'picked_qty', type: 'int', default: 0 }) pickedQty: number
  @Column({ name: 'ordered_qty', type: 'int', default: 0 }) orderedQty: number
}
