// The hook for short picks: a picker who finds an item "not in the bin" asks for that bin to be counted.
// The pick service calls requestCountForShortPick inside its own transaction; the line lands in the
// warehouse's one open short-pick count (opened on first need), unless an open count already waits to
// count that bin × item × lot.
import type { EntityManager } from 'typeorm'
import { Bin } from '../../entities/Bin.js'
import { CountBin, CountLine } from '../../entities/CycleCount.js'
import { AppError } from '../../errors.js'
import { isDuplicateKey } from '../../db/transaction.js'
import { audit } from '../auditService.js'
import type { StockActor } from '../stock/stockLedger.js'
import { onHandAtPoint } from './countLedger.js'

export interface ShortPickCountRequest {
  pickListId: number
  pickListLineId: number
  binId: number
  itemId: number
  lotId: number | null
}

export interface ShortPickCountAnswer {
  countId: number
  lineId: number
  /** False when an open count already had this bin × item × lot waiting (nothing added). */
  created: boolean
}

/**
 * Finds the warehouse's open short-pick count, or opens it. Opening holds the new row's exclusive lock; finding
 * holds a shared one (the duplicate-key check already took it, so asking for an exclusive lock here made two
 * concurrent short picks deadlock). Either way the count can't close under this transaction.
 */
async function openShortPickCount(em: EntityManager, actor: StockActor, warehouseId: number): Promise<{ countId: number; opened: boolean }> {
  try {
    // A duplicate key rolls back this statement only; the caller's transaction goes on.
    await em.query(
      `INSERT INTO cycle_counts (warehouse_id, scope, items_only, status, created_by) VALUES (?, 'short_pick', 1, 'open', ?)`,
      [warehouseId, actor.userId],
    )
    const [row] = await em.query('SELECT LAST_INSERT_ID() AS id')
    return { countId: Number(row.id), opened: true }
  } catch (err) {
    if (!isDuplicateKey(err)) throw err
  }
  // A locking read: a count opened by a concurrent request after this transaction's snapshot is invisible to a plain read.
  const [row] = await em.query('SELECT id FROM cycle_counts WHERE open_short_pick_key = ? LOCK IN SHARE MODE', [warehouseId])
  if (!row) throw AppError.conflict('count_busy', 'The short-pick count changed meanwhile; try again.')
  return { countId: Number(row.id), opened: false }
}

/** The count's bin row, locked; a bin already finished goes back to waiting for the new line. */
export async function countBinFor(em: EntityManager, countId: number, binId: number): Promise<CountBin> {
  await em.query(
    `INSERT INTO count_bins (count_id, bin_id, status) VALUES (?, ?, 'waiting')
     ON DUPLICATE KEY UPDATE status = IF(status = 'done', 'waiting', status)`,
    [countId, binId],
  )
  return em.findOneOrFail(CountBin, { where: { countId, binId }, lock: { mode: 'pessimistic_write' } })
}

/** The next attempt number of a bin × item × lot within a count (1 for the first). */
export async function nextAttempt(em: EntityManager, countId: number, k: { binId: number; itemId: number; lotId: number | null }): Promise<number> {
  const [row] = await em.query(
    'SELECT COALESCE(MAX(attempt), 0) AS n FROM count_lines WHERE count_id = ? AND bin_id = ? AND item_id = ? AND lot_key = ?',
    [countId, k.binId, k.itemId, k.lotId ?? 0],
  )
  return Number(row.n) + 1
}

/**
 * Asks for a count of one bin × item × lot after a short pick "not in the bin". Call it inside the pick
 * confirmation's transaction, after the pick list row is locked. Idempotent per open line: asking again
 * while the line waits returns the same line.
 */
export async function requestCountForShortPick(em: EntityManager, actor: StockActor, req: ShortPickCountRequest): Promise<ShortPickCountAnswer> {
  const bin = await em.findOneBy(Bin, { id: req.binId })
  if (!bin) throw AppError.notFound('bin_not_found', 'That bin was not found.')
  const [waiting] = await em.query(
    `SELECT l.id, l.count_id FROM count_lines l
      WHERE l.bin_id = ? AND l.item_id = ? AND l.lot_key = ? AND l.status IN ('waiting', 'counted') LIMIT 1`,
    [req.binId, req.itemId, req.lotId ?? 0],
  )
  if (waiting) return { countId: Number(waiting.count_id), lineId: Number(waiting.id), created: false }

  const { countId, opened } = await openShortPickCount(em, actor, bin.warehouseId)
  await em.query('INSERT IGNORE INTO count_items (count_id, item_id) VALUES (?, ?)', [countId, req.itemId])
  const countBin = await countBinFor(em, countId, bin.id)
  const key = { binId: bin.id, itemId: req.itemId, lotId: req.lotId, warehouseId: bin.warehouseId }
  // A bin being counted right now: the new line's snapshot stands at the visit's ledger point.
  const counting = countBin.status === 'counting' && countBin.snapshotMoveId !== null
  const line = await em.save(em.create(CountLine, {
    countId, countBinId: countBin.id, warehouseId: bin.warehouseId, binId: bin.id, itemId: req.itemId, lotId: req.lotId,
    attempt: await nextAttempt(em, countId, key), source: 'short_pick', status: 'waiting',
    snapshotQty: counting ? Math.max(0, await onHandAtPoint(em, key, countBin.snapshotMoveId!)) : null,
    snapshotMoveId: counting ? countBin.snapshotMoveId : null,
    snapshotAt: counting ? countBin.startedAt : null,
    pickListId: req.pickListId, pickListLineId: req.pickListLineId,
  }))
  if (opened) await audit(em, actor, 'count.open', 'cycle_count', countId, { warehouseId: bin.warehouseId, scope: 'short_pick' })
  return { countId, lineId: line.id, created: true }
}
