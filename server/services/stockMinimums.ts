// The manual minimum per item and warehouse (item_warehouses.min_qty): below it, the stock screens
// flag the line as low. Setting it never touches the moving-average cost kept in the same row.
import type { DataSource } from 'typeorm'
import type { MinimumInput, MinimumRow } from '../../shared/schemas/stockViews.js'
import { inTransaction } from '../db/transaction.js'
import { AppError } from '../errors.js'
import { audit, type AuditActor } from './auditService.js'

interface MinimumSqlRow { item_id: number; sku: string; warehouse_id: number; warehouse_code: string; min_qty: number | null }

const toRow = (r: MinimumSqlRow): MinimumRow => ({
  itemId: r.item_id, sku: r.sku, warehouseId: r.warehouse_id, warehouseCode: r.warehouse_code, minQty: r.min_qty,
})

/** With an item: one row per active warehouse (null where none is set). Without: every minimum set. */
export async function listMinimums(ds: DataSource, q: { itemId?: number; warehouseId?: number }): Promise<MinimumRow[]> {
  const params: unknown[] = []
  let sql: string
  if (q.itemId) {
    sql = `SELECT i.id AS item_id, i.sku, w.id AS warehouse_id, w.code AS warehouse_code, iw.min_qty
             FROM items i CROSS JOIN warehouses w
             LEFT JOIN item_warehouses iw ON iw.item_id = i.id AND iw.warehouse_id = w.id
            WHERE i.id = ? AND (w.active = 1 OR iw.min_qty IS NOT NULL)`
    params.push(q.itemId)
  } else {
    sql = `SELECT i.id AS item_id, i.sku, w.id AS warehouse_id, w.code AS warehouse_code, iw.min_qty
             FROM item_warehouses iw JOIN items i ON i.id = iw.item_id JOIN warehouses w ON w.id = iw.warehouse_id
            WHERE iw.min_qty IS NOT NULL`
  }
  if (q.warehouseId) {
    sql += ' AND w.id = ?'
    params.push(q.warehouseId)
  }
  const rows: MinimumSqlRow[] = await ds.query(`${sql} ORDER BY i.sku, w.code LIMIT 5000`, params)
  return rows.map(toRow)
}

export async function setMinimum(
  ds: DataSource,
  actor: AuditActor,
  key: { itemId: number; warehouseId: number },
  input: MinimumInput,
): Promise<MinimumRow> {
  return inTransaction(ds, async (em) => {
    const [item] = await em.query('SELECT id, sku FROM items WHERE id = ?', [key.itemId])
    if (!item) throw AppError.notFound('item_not_found', 'That item was not found.')
    const [warehouse] = await em.query('SELECT id, code FROM warehouses WHERE id = ?', [key.warehouseId])
    if (!warehouse) throw AppError.notFound('warehouse_not_found', 'That warehouse was not found.')
    const [before] = await em.query('SELECT min_qty FROM item_warehouses WHERE item_id = ? AND warehouse_id = ? FOR UPDATE', [item.id, warehouse.id])
    await em.query(
      'INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost, min_qty) VALUES (?, ?, 0, ?) ON DUPLICATE KEY UPDATE min_qty = VALUES(min_qty)',
      [item.id, warehouse.id, input.minQty],
    )
    await audit(em, actor, 'stock.minimum.set', 'item_warehouse', `${item.id}:${warehouse.id}`, {
      sku: item.sku, warehouse: warehouse.code, from: before?.min_qty ?? null, to: input.minQty,
    })
    return { itemId: item.id, sku: item.sku, warehouseId: warehouse.id, warehouseCode: warehouse.code, minQty: input.minQty }
  })
}
