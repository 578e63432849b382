// Opening stock: what a business already held when it started on Lumenyard, brought in as moves of kind
// 'opening' in one transaction, many rows per statement (a first import holds tens of thousands of
// lines, which one-by-one writes would take minutes over). The stock service's rules hold as in
// applyMoves: the same lock order (cost rows sorted, then each item's balances in its warehouses in
// index order), the moving average blended from the incoming costs, balances and ledger written together.
import { randomUUID } from 'node:crypto'
import type { EntityManager } from 'typeorm'
import { AppError } from '../../errors.js'
import { blendAverages, lockCostRows, writeAverages } from './averageCost.js'
import { groupKey, type WarehouseGroup } from './balanceLocks.js'
import type { DocRef, StockActor } from './stockLedger.js'

export interface OpeningLine {
  itemId: number
  warehouseId: number
  binId: number
  lotId: number | null
  /** Positive, in stock units. */
  qty: number
  unitCost: string
  note?: string | null
}

export interface CostBefore {
  itemId: number
  warehouseId: number
  avgBefore: string
  onHandBefore: number
}

const CHUNK = 1000

function chunks<T>(rows: readonly T[], size = CHUNK): T[][] {
  const out: T[][] = []
  for (let i = 0; i < rows.length; i += size) out.push(rows.slice(i, i + size))
  return out
}

const sortGroups = (groups: Iterable<WarehouseGroup>) => [...groups].sort((a, b) => a.itemId - b.itemId || a.warehouseId - b.warehouseId)

/** Cost rows (created when missing) and every balance of the groups' items, all locked exclusively in the one order. */
async function lockGroups(em: EntityManager, groups: readonly WarehouseGroup[]) {
  const averages = new Map<string, string>()
  for (const chunk of chunks(groups)) for (const [k, v] of await lockCostRows(em, chunk)) averages.set(k, v)
  const wanted = new Set(groups.map(groupKey))
  const onHand = new Map<string, number>([...wanted].map((k) => [k, 0]))
  const reservedKeys = new Set<string>()
  const itemIds = [...new Set(groups.map((g) => g.itemId))]
  for (const ids of chunks(itemIds)) {
    const rows: { item_id: number; warehouse_id: number; bin_id: number; lot_id: number | null; on_hand: number; reserved: number }[] = await em.query(
      `SELECT item_id, warehouse_id, bin_id, lot_id, on_hand, reserved FROM stock_balances FORCE INDEX (ix_balance_item_wh_bin)
       WHERE item_id IN (${ids.map(() => '?').join(', ')}) ORDER BY item_id, warehouse_id, bin_id, lot_key FOR UPDATE`,
      ids,
    )
    for (const r of rows) {
      const gk = groupKey({ itemId: r.item_id, warehouseId: r.warehouse_id })
      if (!wanted.has(gk)) continue
      onHand.set(gk, onHand.get(gk)! + Number(r.on_hand))
      if (Number(r.reserved) > 0) reservedKeys.add(`${r.item_id}:${r.bin_id}:${r.lot_id ?? 0}`)
    }
  }
  return { averages, onHand, reservedKeys }
}

/** Adds (sign 1) or takes away (sign −1) quantities per balance key, many rows per statement, in lock order. */
async function changeBalances(em: EntityManager, lines: readonly OpeningLine[], sign: 1 | -1): Promise<void> {
  const byKey = new Map<string, OpeningLine & { total: number }>()
  for (const l of lines) {
    const key = `${l.itemId}:${l.binId}:${l.lotId ?? 0}`
    const seen = byKey.get(key)
    if (seen) seen.total += l.qty
    else byKey.set(key, { ...l, total: l.qty })
  }
  const sorted = [...byKey.values()].sort((a, b) => a.itemId - b.itemId || a.warehouseId - b.warehouseId || a.binId - b.binId || (a.lotId ?? 0) - (b.lotId ?? 0))
  for (const chunk of chunks(sorted)) {
    await em.query(
      `INSERT INTO stock_balances (item_id, warehouse_id, bin_id, lot_id, on_hand, reserved) VALUES ${chunk.map(() => '(?, ?, ?, ?, ?, 0)').join(', ')}
       ON DUPLICATE KEY UPDATE on_hand = on_hand ${sign > 0 ? '+' : '-'} VALUES(on_hand)`,
      chunk.flatMap((l) => [l.itemId, l.warehouseId, l.binId, l.lotId, l.total]),
    )
  }
}

async function insertMoves(em: EntityManager, actor: StockActor, lines: readonly OpeningLine[], sign: 1 | -1, doc: DocRef, reason: string | null): Promise<string> {
  const batchId = randomUUID()
  const at = new Date()
  for (const chunk of chunks(lines)) {
    await em.query(
      `INSERT INTO stock_moves (at, move_type, item_id, warehouse_id, bin_id, lot_id, qty, unit_cost, doc_type, doc_id, doc_line_id, reason, note, batch_id, user_id)
       VALUES ${chunk.map(() => "(?, 'opening', ?, ?, ?, ?, ?, ?, ?, ?, NULL, ?, ?, ?, ?)").join(', ')}`,
      // A reversal carries no cost: it blends nothing (the averages are put back as they were), and the
      // valuation replay reads only moves with a cost as blending ones.
      chunk.flatMap((l) => [at, l.itemId, l.warehouseId, l.binId, l.lotId, sign * l.qty, sign > 0 ? l.unitCost : null, doc.docType, doc.docId, reason, l.note ?? null, batchId, actor.userId]),
    )
  }
  return batchId
}

/**
 * Brings the lines in: on hand up, the moving average of each item × warehouse blended from what was
 * there (on hand at its average) and the lines at their costs, in the lines' order. Returns each
 * group's average and on hand from before, which a reversal puts back.
 */
export async function bringInOpeningStock(em: EntityManager, actor: StockActor, lines: readonly OpeningLine[], doc: DocRef): Promise<{ batchId: string; costsBefore: CostBefore[] }> {
  for (const l of lines) if (!Number.isSafeInteger(l.qty) || l.qty <= 0) throw new RangeError(`opening quantity must be a positive integer, got ${l.qty}`)
  const groups = sortGroups(new Map(lines.map((l) => [groupKey(l), { itemId: l.itemId, warehouseId: l.warehouseId }])).values())
  const { averages, onHand } = await lockGroups(em, groups)
  const costsBefore = groups.map((g) => ({ ...g, avgBefore: averages.get(groupKey(g)) ?? '0.0000', onHandBefore: onHand.get(groupKey(g)) ?? 0 }))
  await blendAverages(em, averages, onHand, lines)
  await changeBalances(em, lines, 1)
  const batchId = await insertMoves(em, actor, lines, 1, doc, null)
  return { batchId, costsBefore }
}

/** What an opening-stock document wrote, as lines (its own 'opening' moves with a positive quantity). */
async function documentLines(em: EntityManager, doc: DocRef): Promise<(OpeningLine & { id: number })[]> {
  const rows: { id: string; item_id: number; warehouse_id: number; bin_id: number; lot_id: number | null; qty: number; unit_cost: string; note: string | null }[] = await em.query(
    "SELECT id, item_id, warehouse_id, bin_id, lot_id, qty, unit_cost, note FROM stock_moves WHERE doc_type = ? AND doc_id = ? AND move_type = 'opening' AND qty > 0 ORDER BY id",
    [doc.docType, doc.docId],
  )
  return rows.map((r) => ({ id: Number(r.id), itemId: r.item_id, warehouseId: r.warehouse_id, binId: r.bin_id, lotId: r.lot_id, qty: Number(r.qty), unitCost: r.unit_cost, note: r.note }))
}

/**
 * Takes an opening-stock document back whole, while nothing else has touched what it wrote: no later move
 * of any of its items in any of its warehouses, no units held on its balances. Writes the opposite moves
 * and puts each average back as it was.
 */
export async function takeBackOpeningStock(em: EntityManager, actor: StockActor, doc: DocRef, costsBefore: readonly CostBefore[]): Promise<{ moves: number }> {
  const lines = await documentLines(em, doc)
  if (!lines.length) return { moves: 0 }
  const groups = sortGroups(new Map(lines.map((l) => [groupKey(l), { itemId: l.itemId, warehouseId: l.warehouseId }])).values())
  const { reservedKeys } = await lockGroups(em, groups)
  const held = lines.find((l) => reservedKeys.has(`${l.itemId}:${l.binId}:${l.lotId ?? 0}`))
  if (held) throw await touched(em, held)
  const wanted = new Set(groups.map(groupKey))
  const firstId = lines[0].id
  for (const ids of chunks([...new Set(groups.map((g) => g.itemId))])) {
    // A locking read sees moves committed after this transaction's snapshot; the ledger is append-only.
    const later: { item_id: number; warehouse_id: number }[] = await em.query(
      `SELECT DISTINCT item_id, warehouse_id FROM stock_moves WHERE item_id IN (${ids.map(() => '?').join(', ')}) AND id > ?
         AND NOT (doc_type <=> ? AND doc_id <=> ?) LOCK IN SHARE MODE`,
      [...ids, firstId, doc.docType, doc.docId],
    )
    const hit = later.find((r) => wanted.has(groupKey({ itemId: r.item_id, warehouseId: r.warehouse_id })))
    if (hit) throw await touched(em, { itemId: hit.item_id, warehouseId: hit.warehouse_id })
  }
  await changeBalances(em, lines, -1)
  await insertMoves(em, actor, lines, -1, doc, 'reversed')
  await writeAverages(em, costsBefore.map((c) => [groupKey(c), c.avgBefore] as const))
  return { moves: lines.length }
}

async function touched(em: EntityManager, at: { itemId: number; warehouseId: number }): Promise<AppError> {
  const [row]: { sku: string; code: string }[] = await em.query('SELECT i.sku, w.code FROM items i, warehouses w WHERE i.id = ? AND w.id = ?', [at.itemId, at.warehouseId])
  return AppError.conflict('import_touched', `Stock of ${row?.sku} in ${row?.code} has moved since the import; it can no longer be reversed as a whole.`, { params: { sku: row?.sku ?? '', warehouse: row?.code ?? '' } })
}
