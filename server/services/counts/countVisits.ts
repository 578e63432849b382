// The counter's side of a count, on the handheld: start a bin (its snapshot is taken), enter what is
// there item by item (blind: the ledger's figure is never shown), finish the bin (anything not entered
// counts as none). Every step locks the count row first, then the bin's row, then its lines.
import type { EntityManager } from 'typeorm'
import { classifyScan } from '../../../shared/barcode/scan.js'
import { reconcileCount } from '../../../shared/counts/countVariance.js'
import type { CountEntryInput, CountStartBinInput } from '../../../shared/schemas/counts.js'
import { Bin } from '../../entities/Bin.js'
import { CountBin, CountLine, CycleCount } from '../../entities/CycleCount.js'
import { Item } from '../../entities/Item.js'
import { User } from '../../entities/User.js'
import { AppError, problem } from '../../errors.js'
import { audit, type AuditActor } from '../auditService.js'
import { currentAverage } from '../stock/averageCost.js'
import { findOrCreateLot } from '../stock/stockService.js'
import { ledgerPoint, lockBinBalances, lockedOnHand, movesSince, onHandAtPoint } from './countLedger.js'
import { nextAttempt } from './countShortPick.js'

export async function lockCount(em: EntityManager, countId: number): Promise<CycleCount> {
  const count = await em.findOne(CycleCount, { where: { id: countId }, lock: { mode: 'pessimistic_write' } })
  if (!count) throw new AppError(404, 'count_not_found', 'That count was not found.')
  return count
}

export function requireOpen(count: CycleCount): void {
  if (count.status !== 'open') throw new AppError(409, 'count_not_open', `This count is ${count.status}; nothing more can be counted or decided on it.`, { params: { countStatus: count.status } })
}

async function lockCountBin(em: EntityManager, countId: number, binId: number): Promise<CountBin | null> {
  return em.findOne(CountBin, { where: { countId, binId }, lock: { mode: 'pessimistic_write' } })
}

async function personName(em: EntityManager, userId: number | null): Promise<string> {
  if (userId === null) return 'someone'
  return (await em.findOneBy(User, { id: userId }))?.displayName ?? 'someone'
}

/** The bin a scan names, in the count's warehouse: our label (B:code) or the code typed by hand. */
async function binFromScan(em: EntityManager, warehouseId: number, scan: string): Promise<Bin> {
  const read = classifyScan(scan)
  const code = read.kind === 'bin' ? read.code : read.kind === 'sku' ? read.sku : null
  if (code === null) throw new AppError(400, 'count_scan_not_bin', 'That is not a bin label: scan the bin first.', { fields: { binScan: problem('count_scan_not_bin') } })
  const bin = await em.findOneBy(Bin, { warehouseId, code })
  if (!bin) throw new AppError(404, 'count_bin_unknown', `There is no bin ${code} in this warehouse.`, { params: { bin: code }, fields: { binScan: problem('count_bin_unknown', { bin: code }) } })
  return bin
}

/** Lines for what the bin holds that this count has no line for yet (items-only counts: only their items). */
async function planLinesForVisit(em: EntityManager, count: CycleCount, countBin: CountBin, balances: { itemId: number; lotId: number | null; onHand: number }[]): Promise<void> {
  const asked = count.itemsOnly
    ? new Set(((await em.query('SELECT item_id FROM count_items WHERE count_id = ?', [count.id])) as { item_id: number }[]).map((r) => Number(r.item_id)))
    : null
  const known = new Set(
    ((await em.query('SELECT item_id, lot_key FROM count_lines WHERE count_id = ? AND bin_id = ? FOR UPDATE', [count.id, countBin.binId])) as { item_id: number; lot_key: number }[])
      .map((r) => `${r.item_id}:${r.lot_key}`),
  )
  const fresh = balances.filter((b) => b.onHand > 0 && (!asked || asked.has(b.itemId)) && !known.has(`${b.itemId}:${b.lotId ?? 0}`))
  for (const b of fresh) {
    await em.insert(CountLine, {
      countId: count.id, countBinId: countBin.id, warehouseId: count.warehouseId, binId: countBin.binId, itemId: b.itemId, lotId: b.lotId,
      attempt: 1, source: 'planned', status: 'waiting',
    })
  }
}

export async function startBinVisit(em: EntityManager, actor: AuditActor & { userId: number }, countId: number, input: CountStartBinInput): Promise<{ binId: number }> {
  const count = await lockCount(em, countId)
  requireOpen(count)
  const bin = await binFromScan(em, count.warehouseId, input.binScan)
  const countBin = await lockCountBin(em, count.id, bin.id)
  if (!countBin) throw new AppError(409, 'count_bin_not_in_count', `Bin ${bin.code} is not part of this count.`, { fields: { binScan: problem('count_bin_not_in_count') } })
  if (countBin.status === 'done') throw new AppError(409, 'count_bin_done', `Bin ${bin.code} is already counted.`, { params: { bin: bin.code } })
  if (countBin.status === 'counting') {
    if (countBin.startedBy !== actor.userId) {
      if (!input.takeOver) {
        const who = await personName(em, countBin.startedBy)
        throw new AppError(409, 'count_bin_taken', `${who} is counting bin ${bin.code}. Take it over only if they stopped.`, { params: { who } })
      }
      // The visit goes on with its snapshot and what was entered; only who carries it on changes.
      await em.update(CountBin, { id: countBin.id }, { startedBy: actor.userId })
      await audit(em, actor, 'count.bin_take_over', 'cycle_count', count.id, { bin: bin.code, from: countBin.startedBy })
    }
    return { binId: bin.id }
  }
  // A new visit: lock the bin's balances (running stock operations on them finish first), then note the ledger point.
  const balances = await lockBinBalances(em, bin.id)
  const point = await ledgerPoint(em)
  const now = new Date()
  await em.update(CountBin, { id: countBin.id }, { status: 'counting', visits: countBin.visits + 1, snapshotMoveId: point, startedBy: actor.userId, startedAt: now, finishedBy: null, finishedAt: null })
  await planLinesForVisit(em, count, countBin, balances)
  const onHand = new Map(balances.map((b) => [`${b.itemId}:${b.lotId ?? 0}`, b.onHand]))
  const waiting = await em.find(CountLine, { where: { countId: count.id, binId: bin.id, status: 'waiting' }, lock: { mode: 'pessimistic_write' } })
  for (const line of waiting) {
    await em.update(CountLine, { id: line.id }, {
      snapshotQty: onHand.get(`${line.itemId}:${line.lotId ?? 0}`) ?? 0, snapshotMoveId: point, snapshotAt: now,
      countedQty: null, movesSince: null, expectedQty: null, variance: null, countedBy: null, countedAt: null, countedMoveId: null,
    })
  }
  return { binId: bin.id }
}

async function requireOwnVisit(em: EntityManager, count: CycleCount, binId: number, userId: number): Promise<CountBin> {
  const countBin = await lockCountBin(em, count.id, binId)
  if (!countBin) throw new AppError(409, 'count_bin_not_in_count', 'That bin is not part of this count.')
  if (countBin.status !== 'counting') throw new AppError(409, 'count_bin_not_started', 'Scan the bin to start counting it first.')
  if (countBin.startedBy !== userId) {
    const who = await personName(em, countBin.startedBy)
    throw new AppError(409, 'count_bin_taken', `${who} is counting this bin now.`, { params: { who } })
  }
  return countBin
}

/** Reconciles one line at the moment its figure is entered: the moves since the visit's snapshot, the variance, the cost. */
async function recordFigure(em: EntityManager, line: CountLine, counted: number, userId: number): Promise<void> {
  const key = { itemId: line.itemId, binId: line.binId, lotId: line.lotId, warehouseId: line.warehouseId }
  await lockedOnHand(em, key) // waits for a stock operation on this balance that is still running
  const since = await movesSince(em, key, line.snapshotMoveId!)
  const point = await ledgerPoint(em)
  const { expected, variance } = reconcileCount({ snapshot: line.snapshotQty ?? 0, movesSince: since, counted })
  await em.update(CountLine, { id: line.id }, {
    countedQty: counted, movesSince: since, expectedQty: expected, variance, countedBy: userId, countedAt: new Date(), countedMoveId: point,
    unitCost: await currentAverage(em, line.itemId, line.warehouseId),
  })
}

export async function enterCount(em: EntityManager, actor: AuditActor & { userId: number }, countId: number, input: CountEntryInput): Promise<{ lineId: number }> {
  const count = await lockCount(em, countId)
  requireOpen(count)
  const countBin = await requireOwnVisit(em, count, input.binId, actor.userId)
  const item = await em.findOneBy(Item, { id: input.itemId })
  if (!item) throw new AppError(404, 'item_not_found', 'That item was not found.', { fields: { itemId: problem('item_not_found') } })
  if (count.itemsOnly) {
    const [asked] = await em.query('SELECT 1 AS yes FROM count_items WHERE count_id = ? AND item_id = ?', [count.id, item.id])
    if (!asked) throw new AppError(409, 'count_item_not_asked', `${item.sku} is not one of the items this count looks at; count only the listed items.`, { params: { sku: item.sku }, fields: { itemId: problem('count_item_not_asked', { sku: item.sku }) } })
  }
  const lotId = input.lotCode ? (await findOrCreateLot(em, item.id, input.lotCode)).id : null
  const key = { binId: input.binId, itemId: item.id, lotId }
  const [latestRow] = await em.query(
    'SELECT id FROM count_lines WHERE count_id = ? AND bin_id = ? AND item_id = ? AND lot_key = ? ORDER BY attempt DESC LIMIT 1 FOR UPDATE',
    [count.id, key.binId, key.itemId, lotId ?? 0],
  )
  const same = latestRow ? await em.findOneByOrFail(CountLine, { id: Number(latestRow.id) }) : null
  let line: CountLine
  if (!same) {
    // Found by the counter: its snapshot stands at the visit's ledger point, like the lines planned at the start.
    const snapshot = await onHandAtPoint(em, { ...key, warehouseId: count.warehouseId }, countBin.snapshotMoveId!)
    line = await em.save(em.create(CountLine, {
      countId: count.id, countBinId: countBin.id, warehouseId: count.warehouseId, ...key, attempt: await nextAttempt(em, count.id, key),
      source: 'found', status: 'waiting', snapshotQty: Math.max(0, snapshot), snapshotMoveId: countBin.snapshotMoveId, snapshotAt: countBin.startedAt,
    }))
  } else if (same.status !== 'waiting') {
    throw new AppError(409, 'count_line_settled', `${item.sku}${lotId ? ` lot ${input.lotCode}` : ''} was already counted in this count; a reviewer can ask for a recount.`, { params: { sku: item.sku, lot: lotId ? (input.lotCode ?? '') : '' } })
  } else {
    line = same
  }
  await recordFigure(em, line, input.qty, actor.userId)
  return { lineId: line.id }
}

/** Closes the count when no bin waits and no line waits for a counter or a reviewer. */
export async function closeIfDone(em: EntityManager, actor: AuditActor, count: CycleCount): Promise<boolean> {
  // Locking reads: see lines a short pick added after this transaction's snapshot.
  const [lines] = await em.query(`SELECT COUNT(*) AS n FROM count_lines WHERE count_id = ? AND status IN ('waiting', 'counted') LOCK IN SHARE MODE`, [count.id])
  const [bins] = await em.query(`SELECT COUNT(*) AS n FROM count_bins WHERE count_id = ? AND status <> 'done' LOCK IN SHARE MODE`, [count.id])
  if (Number(lines.n) > 0 || Number(bins.n) > 0) return false
  await em.update(CycleCount, { id: count.id }, { status: 'closed', closedAt: new Date() })
  await audit(em, actor, 'count.close', 'cycle_count', count.id, { warehouseId: count.warehouseId })
  return true
}

export async function finishBinVisit(em: EntityManager, actor: AuditActor & { userId: number }, countId: number, binId: number): Promise<{ closed: boolean; lines: number; differences: number }> {
  const count = await lockCount(em, countId)
  requireOpen(count)
  const countBin = await requireOwnVisit(em, count, binId, actor.userId)
  const lines = await em.find(CountLine, { where: { countId: count.id, binId, status: 'waiting' }, lock: { mode: 'pessimistic_write' } })
  let differences = 0
  for (const line of lines) {
    // Not entered: the counter found none. Reconciled now, like an entry of 0.
    if (line.countedQty === null) await recordFigure(em, line, 0, actor.userId)
    const done = await em.findOneByOrFail(CountLine, { id: line.id })
    const status = done.variance === 0 ? 'matched' : 'counted'
    if (status === 'counted') differences++
    await em.update(CountLine, { id: line.id }, { status })
  }
  await em.update(CountBin, { id: countBin.id }, { status: 'done', finishedBy: actor.userId, finishedAt: new Date() })
  return { closed: await closeIfDone(em, actor, count), lines: lines.length, differences }
}
