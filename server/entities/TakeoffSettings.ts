import { Column, Entity, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm'

/** An admin's change to a shipped material rule, or a rule of their own (rule_key not shipped). */
@Entity({ name: 'material_rules' })
export class MaterialRuleRow {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'rule_key', type: 'varchar', length: 60, unique: true }) ruleKey: string
  /** The rule as shared/schemas/takeoff.ts materialRuleSchema. */
  @Column({ name: 'rule_json', type: 'text' }) ruleJson: string
  @Column({ type: 'boolean', default: true }) enabled: boolean
  @Column({ name: 'updated_by', type: 'int', nullable: true }) updatedBy: number | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}

/** Waste allowance per material family, percent; a family without a row keeps the shipped default. */
@Entity({ name: 'waste_allowances' })
export class WasteAllowance {
  @PrimaryColumn({ type: 'varchar', length: 20 }) family: string
  @Column({ type: 'decimal', precision: 5, scale: 2 }) pct: string
  @Column({ name: 'updated_by', type: 'int', nullable: true }) updatedBy: number | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}

/** Which catalog item fills a material role, for one block or any (null), one joint system or either (null). */
@Entity({ name: 'material_role_items' })
export class MaterialRoleItem {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ type: 'varchar', length: 20 }) role: string
  @Column({ name: 'joint_kind', type: 'varchar', length: 10, nullable: true }) jointKind: 'spacer' | 'mortar' | null
  @Column({ name: 'block_item_id', type: 'int', nullable: true }) blockItemId: number | null
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'piece_length_mm', type: 'decimal', precision: 10, scale: 2, nullable: true }) pieceLengthMm: string | null
  @Column({ name: 'yield_ml', type: 'decimal', precision: 12, scale: 2, nullable: true }) yieldMl: string | null
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  @Column({ name: 'updated_by', type: 'int', nullable: true }) updatedBy: number | null
  @UpdateDateColumn({ name: 'updated_at', type: 'datetime' }) updatedAt: Date
}

/** The bound takeoff and per-wall results (layout, sections, drawing) a saved bill was computed from. */
@Entity({ name: 'bom_snapshots' })
export class BomSnapshot {
  @PrimaryColumn({ name: 'bom_id', type: 'int' }) bomId: number
  @Column({ type: 'varchar', length: 2 }) unit: 'in' | 'mm'
  @Column({ name: 'input_json', type: 'mediumtext' }) inputJson: string
  @Column({ name: 'walls_json', type: 'mediumtext' }) wallsJson: string
}
