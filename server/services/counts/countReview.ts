// Deciding counted lines: approve (the variance becomes a 'count' adjustment through the stock service) or
// ask for a recount (a new attempt of the line, the bin back on the visit list). Reviewers are admins or a
// role the admin chose, and never the person who counted the line. Cancelling a count (admin) changes no stock.
import type { EntityManager } from 'typeorm'
import { reviewRefusal, type ReviewRefusal } from '../../../shared/counts/countReviewRules.js'
import type { CountReviewInput } from '../../../shared/schemas/counts.js'
import type { Role } from '../../../shared/roles.js'
import { CountBin, CountLine } from '../../entities/CycleCount.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { adjust } from '../stock/stockService.js'
import { countSettings } from './countSettings.js'
import { closeIfDone, lockCount, requireOpen } from './countVisits.js'

export interface Reviewer extends AuditActor {
  userId: number
  roles: readonly Role[]
}

const REFUSALS: Record<ReviewRefusal, (lineId: number) => AppError> = {
  count_reviewer_role: () => new AppError(403, 'count_reviewer_role', 'Your role does not review counts; an admin decides who does.'),
  count_self_approval: (id) => new AppError(403, 'count_self_approval', `You counted line ${id} yourself; someone else approves it.`, { params: { line: id } }),
  count_line_not_counted: (id) => new AppError(409, 'count_line_not_counted', `Line ${id} is not waiting for a decision (not counted yet, or decided already).`, { params: { line: id } }),
}

/**
 * A variance is relative to the ledger when the line was counted. Another count's adjustment of the same
 * bin × item × lot since then already corrected the record, so approving this one too would correct it twice.
 */
async function staleSince(em: EntityManager, line: CountLine): Promise<boolean> {
  const [row] = await em.query(
    `SELECT COUNT(*) AS n FROM stock_moves
      WHERE item_id = ? AND warehouse_id = ? AND bin_id = ? AND lot_id <=> ? AND move_type = 'count' AND id > ?`,
    [line.itemId, line.warehouseId, line.binId, line.lotId, line.countedMoveId ?? line.snapshotMoveId ?? '0'],
  )
  return Number(row.n) > 0
}

async function approve(em: EntityManager, reviewer: Reviewer, line: CountLine, note: string | null): Promise<void> {
  if (await staleSince(em, line)) {
    throw new AppError(409, 'count_line_stale', `Line ${line.id}: another count adjusted this bin and item after it was counted; ask for a recount.`, { params: { line: line.id } })
  }
  const applied = await adjust(em, { userId: reviewer.userId }, {
    itemId: line.itemId, binId: line.binId, lotId: line.lotId, delta: line.variance!, reason: 'counted',
    note: `Cycle count ${line.countId}, line ${line.id}`,
    doc: { docType: 'cycle_count', docId: line.countId, docLineId: line.id },
  })
  await em.update(CountLine, { id: line.id }, { status: 'approved', reviewedBy: reviewer.userId, reviewedAt: new Date(), reviewNote: note, moveId: applied.moves[0].id })
}

async function recount(em: EntityManager, reviewer: Reviewer, line: CountLine, note: string | null): Promise<void> {
  await em.update(CountLine, { id: line.id }, { status: 'recounted', reviewedBy: reviewer.userId, reviewedAt: new Date(), reviewNote: note })
  await em.insert(CountLine, {
    countId: line.countId, countBinId: line.countBinId, warehouseId: line.warehouseId, binId: line.binId, itemId: line.itemId, lotId: line.lotId,
    attempt: line.attempt + 1, recountOf: line.id, source: line.source, status: 'waiting', pickListId: line.pickListId, pickListLineId: line.pickListLineId,
  })
  await em.update(CountBin, { id: line.countBinId, status: 'done' }, { status: 'waiting' })
}

export async function reviewCount(em: EntityManager, reviewer: Reviewer, countId: number, input: CountReviewInput): Promise<{ approved: number; recounts: number; closed: boolean }> {
  const count = await lockCount(em, countId)
  requireOpen(count)
  const { reviewerRoles } = await countSettings(em)
  const ids = [...new Set(input.decisions.map((d) => d.lineId))]
  if (ids.length !== input.decisions.length) throw new AppError(400, 'count_decision_twice', 'Each line takes one decision.', { fields: { decisions: problem('count_decision_twice') } })
  let approved = 0
  let recounts = 0
  // In line order, so two reviews of one count lock its lines (and their balances) in the same order.
  for (const d of [...input.decisions].sort((a, b) => a.lineId - b.lineId)) {
    const line = await em.findOne(CountLine, { where: { id: d.lineId, countId: count.id }, lock: { mode: 'pessimistic_write' } })
    if (!line) throw new AppError(400, 'count_line_not_in_count', `Line ${d.lineId} is not on this count.`, { params: { line: d.lineId }, fields: { decisions: problem('count_line_not_in_count', { line: d.lineId }) } })
    const refusal = reviewRefusal(reviewer, reviewerRoles, line, d.action)
    if (refusal) throw REFUSALS[refusal](line.id)
    if (d.action === 'approve') {
      await approve(em, reviewer, line, d.note ?? null)
      approved++
    } else {
      await recount(em, reviewer, line, d.note ?? null)
      recounts++
    }
  }
  await audit(em, reviewer, 'count.review', 'cycle_count', count.id, { decisions: input.decisions.map((d) => ({ lineId: d.lineId, action: d.action })) })
  return { approved, recounts, closed: await closeIfDone(em, reviewer, count) }
}

export async function cancelCount(em: EntityManager, actor: AuditActor, countId: number, reason: string): Promise<{ cancelled: true }> {
  const count = await lockCount(em, countId)
  requireOpen(count)
  await em.query(`UPDATE count_lines SET status = 'cancelled' WHERE count_id = ? AND status IN ('waiting', 'counted')`, [count.id])
  await em.query('UPDATE cycle_counts SET status = ?, cancelled_by = ?, cancelled_at = CURRENT_TIMESTAMP(3), cancel_reason = ? WHERE id = ?', ['cancelled', actor.userId, reason, count.id])
  await audit(em, actor, 'count.cancel', 'cycle_count', count.id, { reason })
  return { cancelled: true }
}
