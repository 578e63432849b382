// Where a count meets the ledger: the snapshot point of a bin visit and the moves since it.
// A visit's snapshot is the on-hand of each balance in the bin, read with a shared lock (so any stock
// operation on those rows that is still running finishes first, and none starts until the snapshot is
// stored), and the highest stock move id at that moment. Every move in the bin after it has a higher id,
// so "moves since" is a sum over id > snapshot_move_id; picking never stops while a bin is counted.
import type { EntityManager } from 'typeorm'

export interface BalanceQty {
  itemId: number
  lotId: number | null
  onHand: number
}

export interface LineKey {
  itemId: number
  binId: number
  lotId: number | null
}

/** The balances of one bin, share-locked. */
export async function lockBinBalances(em: EntityManager, binId: number): Promise<BalanceQty[]> {
  const rows: { item_id: number; lot_id: number | null; on_hand: number }[] = await em.query(
    'SELECT item_id, lot_id, on_hand FROM stock_balances WHERE bin_id = ? LOCK IN SHARE MODE',
    [binId],
  )
  return rows.map((r) => ({ itemId: Number(r.item_id), lotId: r.lot_id === null ? null : Number(r.lot_id), onHand: Number(r.on_hand) }))
}

/** One balance's on hand, share-locked by its unique key (0 when the row does not exist). */
export async function lockedOnHand(em: EntityManager, k: LineKey): Promise<number> {
  const [row] = await em.query(
    'SELECT on_hand FROM stock_balances WHERE item_id = ? AND bin_id = ? AND lot_key = ? LOCK IN SHARE MODE',
    [k.itemId, k.binId, k.lotId ?? 0],
  )
  return row ? Number(row.on_hand) : 0
}

/** The ledger's last move id: read after the balances are locked, it marks the snapshot. */
export async function ledgerPoint(em: EntityManager): Promise<string> {
  const [row] = await em.query('SELECT COALESCE(MAX(id), 0) AS id FROM stock_moves')
  return String(row.id)
}

/** Net quantity moved into (+) or out of (−) one bin × item × lot after the snapshot point. */
export async function movesSince(em: EntityManager, k: LineKey & { warehouseId: number }, sinceMoveId: string): Promise<number> {
  const [row] = await em.query(
    `SELECT COALESCE(SUM(qty), 0) AS qty FROM stock_moves
      WHERE item_id = ? AND warehouse_id = ? AND bin_id = ? AND lot_id <=> ? AND id > ?`,
    [k.itemId, k.warehouseId, k.binId, k.lotId, sinceMoveId],
  )
  return Number(row.qty)
}

/**
 * The on-hand at the snapshot point of a line that joins a visit already under way (found by the counter,
 * or asked for by a short pick): what is there now less what moved since.
 */
export async function onHandAtPoint(em: EntityManager, k: LineKey & { warehouseId: number }, sinceMoveId: string): Promise<number> {
  const now = await lockedOnHand(em, k)
  return now - (await movesSince(em, k, sinceMoveId))
}
