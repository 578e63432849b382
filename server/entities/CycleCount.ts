import { Column, Entity, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm'
import type { CountBinStatus, CountLineSource, CountLineStatus, CountScope, CountStatus } from '../../shared/counts/countTerms.js'

/** A cycle count of one warehouse: what it covers, who opened it, and whether it is still open. */
@Entity({ name: 'cycle_counts' })
export class CycleCount {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ type: 'varchar', length: 12 }) scope: CountScope
  /** JSON: the aisle, the classes and limit of an ABC count, … (what the screens show as the count's title). */
  @Column({ name: 'scope_detail', type: 'varchar', length: 400, nullable: true }) scopeDetail: string | null
  /** Count only the items in count_items (ABC and short-pick counts); otherwise everything in the bins. */
  @Column({ name: 'items_only', type: 'boolean', default: false }) itemsOnly: boolean
  @Column({ type: 'varchar', length: 12, default: 'open' }) status: CountStatus
  @Column({ type: 'varchar', length: 200, nullable: true }) note: string | null
  @Column({ name: 'created_by', type: 'int', nullable: true }) createdBy: number | null
  @Column({ name: 'created_at', type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date
  @Column({ name: 'closed_at', type: 'datetime', precision: 3, nullable: true }) closedAt: Date | null
  @Column({ name: 'cancelled_by', type: 'int', nullable: true }) cancelledBy: number | null
  @Column({ name: 'cancelled_at', type: 'datetime', precision: 3, nullable: true }) cancelledAt: Date | null
  @Column({ name: 'cancel_reason', type: 'varchar', length: 200, nullable: true }) cancelReason: string | null
}

/** The items an items-only count looks at. */
@Entity({ name: 'count_items' })
export class CountItem {
  @PrimaryColumn({ name: 'count_id', type: 'int' }) countId: number
  @PrimaryColumn({ name: 'item_id', type: 'int' }) itemId: number
}

/** A bin to visit. Starting a visit records the ledger point (the last move id) the bin's snapshot stands at. */
@Entity({ name: 'count_bins' })
export class CountBin {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'count_id', type: 'int' }) countId: number
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ type: 'varchar', length: 10, default: 'waiting' }) status: CountBinStatus
  @Column({ type: 'int', default: 0 }) visits: number
  @Column({ name: 'snapshot_move_id', type: 'bigint', nullable: true }) snapshotMoveId: string | null
  @Column({ name: 'started_by', type: 'int', nullable: true }) startedBy: number | null
  @Column({ name: 'started_at', type: 'datetime', precision: 3, nullable: true }) startedAt: Date | null
  @Column({ name: 'finished_by', type: 'int', nullable: true }) finishedBy: number | null
  @Column({ name: 'finished_at', type: 'datetime', precision: 3, nullable: true }) finishedAt: Date | null
}

/**
 * One bin × item × lot, one attempt. expected = snapshot + the moves in that bin since the snapshot (picks,
 * receipts, moves made while the bin was being counted); variance = counted − expected.
 */
@Entity({ name: 'count_lines' })
export class CountLine {
  @PrimaryGeneratedColumn({ type: 'int' }) id: number
  @Column({ name: 'count_id', type: 'int' }) countId: number
  @Column({ name: 'count_bin_id', type: 'int' }) countBinId: number
  @Column({ name: 'warehouse_id', type: 'int' }) warehouseId: number
  @Column({ name: 'bin_id', type: 'int' }) binId: number
  @Column({ name: 'item_id', type: 'int' }) itemId: number
  @Column({ name: 'lot_id', type: 'int', nullable: true }) lotId: number | null
  @Column({ type: 'int', default: 1 }) attempt: number
  @Column({ name: 'recount_of', type: 'int', nullable: true }) recountOf: number | null
  @Column({ type: 'varchar', length: 12, default: 'planned' }) source: CountLineSource
  @Column({ type: 'varchar', length: 10, default: 'waiting' }) status: CountLineStatus
  @Column({ name: 'snapshot_qty', type: 'int', nullable: true }) snapshotQty: number | null
  @Column({ name: 'snapshot_move_id', type: 'bigint', nullable: true }) snapshotMoveId: string | null
  @Column({ name: 'snapshot_at', type: 'datetime', precision: 3, nullable: true }) snapshotAt: Date | null
  @Column({ name: 'counted_qty', type: 'int', nullable: true }) countedQty: number | null
  @Column({ name: 'moves_since', type: 'int', nullable: true }) movesSince: number | null
  @Column({ name: 'expected_qty', type: 'int', nullable: true }) expectedQty: number | null
  @Column({ type: 'int', nullable: true }) variance: number | null
  /** The moving average when counted: values the variance. */
  @Column({ name: 'unit_cost', type: 'decimal', precision: 12, scale: 4, nullable: true }) unitCost: string | null
  @Column({ name: 'counted_by', type: 'int', nullable: true }) countedBy: number | null
  @Column({ name: 'counted_at', type: 'datetime', precision: 3, nullable: true }) countedAt: Date | null
  /** The ledger's last move id when the figure was entered: moves after it happened after the count. */
  @Column({ name: 'counted_move_id', type: 'bigint', nullable: true }) countedMoveId: string | null
  @Column({ name: 'reviewed_by', type: 'int', nullable: true }) reviewedBy: number | null
  @Column({ name: 'reviewed_at', type: 'datetime', precision: 3, nullable: true }) reviewedAt: Date | null
  @Column({ name: 'review_note', type: 'varchar', length: 200, nullable: true }) reviewNote: string | null
  /** The adjustment the approved variance became. */
  @Column({ name: 'move_id', type: 'bigint', nullable: true }) moveId: string | null
  @Column({ name: 'pick_list_id', type: 'int', nullable: true }) pickListId: number | null
  @Column({ name: 'pick_list_line_id', type: 'int', nullable: true }) pickListLineId: number | null
  @Column({ name: 'created_at', type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' }) createdAt: Date
}
