// Accepting suggestions: each chosen line becomes an 'accepted' purchase_suggestions row for its vendor, with
// the working that produced it. The purchasing screens turn accepted rows into draft purchase orders.
// A line already accepted and not yet ordered is skipped: the unique open_reorder_key makes that hold even for
// two requests racing each other, and an Idempotency-Key replays the first answer.
import type { DataSource, EntityManager } from 'typeorm'
import type { AcceptInput, AcceptResult } from '../../../shared/schemas/reorder.js'
import { isDuplicateKey } from '../../db/transaction.js'
import { AppError, type FieldProblems, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { computeReorderLines, type ComputedLines } from './reorderLines.js'
import { lineKey } from './usageQueries.js'

type Computed = ComputedLines['lines'][number]
type Skip = AcceptResult['skipped'][number]['reason']

function checkInput(input: AcceptInput, byKey: Map<string, Computed>): void {
  const fields: FieldProblems = {}
  const seen = new Set<string>()
  input.lines.forEach((l, i) => {
    const key = lineKey(l.itemId, l.warehouseId)
    if (seen.has(key)) fields[`lines.${i}`] = problem('line_listed_twice')
    seen.add(key)
    const found = byKey.get(key)
    if (l.qty === undefined || !found) return
    const { packSize, minimumOrder } = found.line
    if (l.qty % packSize !== 0) fields[`lines.${i}.qty`] = problem('not_multiple', { divisor: packSize })
    else if (l.qty < minimumOrder) fields[`lines.${i}.qty`] = problem('vendor_minimum', { min: minimumOrder })
  })
  if (Object.keys(fields).length) throw AppError.badRequest('lines_need_attention', 'Some lines need attention.', { fields })
}

function skipReason(found: Computed | undefined, qty: number): Skip | null {
  if (!found) return 'notFound'
  if (found.line.vendorId === null) return 'noVendor'
  if (found.line.openSuggestionId !== null) return 'alreadyAccepted'
  return qty > 0 ? null : 'nothingToOrder'
}

function explanationJson(found: Computed, qty: number, fromBuyer: boolean, window: ComputedLines['window']): string {
  const l = found.line
  return JSON.stringify({
    computedAt: new Date().toISOString(),
    window: { start: window.start, end: window.end, days: window.days },
    status: l.status,
    qty: { chosen: qty, suggested: l.suggestedOrder, from: fromBuyer ? 'buyer' : 'suggestion' },
    figures: {
      position: l.position, reorderPoint: l.reorderPoint, safetyStock: l.safetyStock, eoq: l.eoq, lotSize: l.lotSize,
      orderUpToLevel: l.orderUpToLevel, meanDaily: l.meanDaily, sdDaily: l.sdDaily, leadTimeDays: l.leadTimeDays,
      leadTimeSdDays: l.leadTimeSdDays, leadTimeSource: l.leadTimeSource, abcClass: l.abcClass,
    },
    policySources: found.effective.sources,
    overrideReason: found.effective.overrideReason,
    inputs: found.explanation.inputs,
    steps: found.explanation.steps,
  })
}

/** The new row's id, or null when an open reorder suggestion for the line got there first (unique key). */
async function insertOpen(em: EntityManager, values: unknown[]): Promise<number | null> {
  try {
    const res: { insertId: number } = await em.query(
      `INSERT INTO purchase_suggestions (item_id, warehouse_id, vendor_id, qty, status, source, explanation, accepted_by)
       VALUES (?, ?, ?, ?, 'accepted', 'reorder', ?, ?)`,
      values,
    )
    return Number(res.insertId)
  } catch (err) {
    // InnoDB undoes only the failed statement, so the rest of the transaction goes on.
    if (isDuplicateKey(err)) return null
    throw err
  }
}

/** Reads the figures first (outside the write), then writes every accepted line in the caller's transaction. */
export async function prepareAccept(ds: DataSource, input: AcceptInput) {
  const computed = await computeReorderLines(ds, { only: input.lines, explain: true })
  const byKey = new Map(computed.lines.map((c) => [c.line.key, c]))
  checkInput(input, byKey)
  return async (em: EntityManager, actor: AuditActor): Promise<AcceptResult> => {
    const result: AcceptResult = { accepted: [], skipped: [] }
    for (const l of input.lines) {
      const found = byKey.get(lineKey(l.itemId, l.warehouseId))
      const qty = l.qty ?? found?.line.suggestedOrder ?? 0
      const reason = skipReason(found, qty)
      if (reason || !found) {
        result.skipped.push({ itemId: l.itemId, warehouseId: l.warehouseId, reason: reason ?? 'notFound' })
        continue
      }
      const vendorId = found.line.vendorId!
      const id = await insertOpen(em, [l.itemId, l.warehouseId, vendorId, qty, explanationJson(found, qty, l.qty !== undefined, computed.window), actor.userId])
      if (id !== null) result.accepted.push({ id, itemId: l.itemId, warehouseId: l.warehouseId, vendorId, qty })
      else result.skipped.push({ itemId: l.itemId, warehouseId: l.warehouseId, reason: 'alreadyAccepted' })
    }
    if (result.accepted.length) await audit(em, actor, 'reorder.accept', 'purchase_suggestion', null, result.accepted)
    return result
  }
}
