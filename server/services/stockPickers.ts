// What the stock forms choose from: warehouses with their bins, items by search, and what a scanned
// code names (the screen classifies the scan with shared/barcode/scan.ts, this finds the records).
import type { DataSource } from 'typeorm'
import type { ItemOption, LookupAnswer, LookupQuery, Place } from '../../shared/schemas/stockViews.js'
import { gtinForms } from '../../shared/barcode/checkDigit.js'
import { containsPattern, prefixPattern } from '../db/likePattern.js'
import { executeRows } from '../db/prepared.js'
import { marks } from './imports/importFacts.js'
import { AppError, problem } from '../errors.js'

interface ItemSqlRow { id: number; sku: string; name: string; stock_unit: ItemOption['stockUnit']; gtin: string | null; match_lot: number }

const ITEM_COLUMNS = 'i.id, i.sku, i.name, i.stock_unit, i.gtin, i.match_lot'
const toItem = (r: ItemSqlRow): ItemOption => ({ id: r.id, sku: r.sku, name: r.name, stockUnit: r.stock_unit, gtin: r.gtin, matchLot: Boolean(r.match_lot) })

export async function listPlaces(ds: DataSource): Promise<Place[]> {
  const warehouses: { id: number; code: string; name: string; active: number }[] = await ds.query('SELECT id, code, name, active FROM warehouses ORDER BY code')
  const bins: { id: number; warehouse_id: number; code: string; kind: Place['bins'][number]['kind']; active: number }[] = await ds.query(
    'SELECT id, warehouse_id, code, kind, active FROM bins ORDER BY warehouse_id, code',
  )
  const natural = (a: { code: string }, b: { code: string }) => a.code.localeCompare(b.code, 'en', { numeric: true })
  return warehouses.map((w) => ({
    id: w.id, code: w.code, name: w.name, active: Boolean(w.active),
    bins: bins.filter((b) => b.warehouse_id === w.id).sort(natural).map((b) => ({ id: b.id, code: b.code, kind: b.kind, active: Boolean(b.active) })),
  }))
}

/** Up to 30 active, stocked items: SKU first, then name or GTIN matches. */
export async function itemOptions(ds: DataSource, q: { q?: string; ids?: number[] }): Promise<ItemOption[]> {
  if (q.ids?.length) return (await ds.query(`SELECT ${ITEM_COLUMNS} FROM items i WHERE i.id IN (?)`, [q.ids])).map(toItem)
  const text = q.q ?? ''
  const rows: ItemSqlRow[] = await ds.query(
    `SELECT ${ITEM_COLUMNS} FROM items i
      WHERE i.active = 1 AND i.made_to_order = 0 AND (i.sku LIKE ? OR i.name LIKE ? OR i.gtin LIKE ?)
      ORDER BY i.sku LIKE ? DESC, i.sku LIMIT 30`,
    [containsPattern(text), containsPattern(text), containsPattern(text), prefixPattern(text)],
  )
  return rows.map(toItem)
}

/**
 * The item a scanned GTIN or typed SKU names. GTINs match in any of their 8/12/13/14-digit forms, compared
 * on the indexed column as stored (padding the column instead walked the whole index on every scan).
 */
export function itemLookupSql(kind: 'gtin' | 'sku', code: string): { sql: string; params: unknown[] } {
  if (kind === 'sku') return { sql: `SELECT ${ITEM_COLUMNS} FROM items i WHERE i.sku = ?`, params: [code] }
  const forms = gtinForms(code)
  return { sql: `SELECT ${ITEM_COLUMNS} FROM items i WHERE i.gtin IN (${marks(forms.length)})`, params: forms }
}

/** A scan, many a second from each handheld: a prepared statement (db/prepared.ts). */
async function findItem(ds: DataSource, q: LookupQuery): Promise<ItemOption> {
  const { sql, params } = itemLookupSql(q.kind === 'gtin' ? 'gtin' : 'sku', q.code)
  const rows = await executeRows<ItemSqlRow>(ds, sql, params)
  if (!rows.length) throw AppError.notFound('item_code_not_found', `No item has the ${q.kind === 'gtin' ? 'GTIN' : 'SKU'} ${q.code}.`, { params: { code: q.code } })
  return toItem(rows[0])
}

export async function lookupScan(ds: DataSource, q: LookupQuery): Promise<LookupAnswer> {
  if (q.kind === 'bin') {
    const rows = await ds.query(
      `SELECT bn.id, bn.code, bn.kind, bn.active, bn.warehouse_id, w.code AS warehouse_code FROM bins bn JOIN warehouses w ON w.id = bn.warehouse_id
        WHERE bn.code = ? ${q.warehouseId ? 'AND bn.warehouse_id = ?' : ''}`,
      q.warehouseId ? [q.code, q.warehouseId] : [q.code],
    )
    if (!rows.length) throw AppError.notFound('bin_code_not_found', `Bin ${q.code}${q.warehouseId ? ' in this warehouse' : ''} was not found.`, { params: { bin: q.code } })
    if (rows.length > 1) throw AppError.badRequest('bin_code_ambiguous', `Bin ${q.code} exists in several warehouses; choose the warehouse first.`, { params: { bin: q.code }, fields: { warehouseId: problem('invalid_choice') } })
    const b = rows[0]
    return { item: null, lot: null, bin: { id: b.id, code: b.code, kind: b.kind, active: Boolean(b.active), warehouseId: b.warehouse_id, warehouseCode: b.warehouse_code } }
  }
  const item = await findItem(ds, q)
  if (!q.lotCode) return { item, lot: null, bin: null }
  const [lot] = await ds.query('SELECT id, code, item_id AS itemId FROM lots WHERE item_id = ? AND code = ?', [item.id, q.lotCode])
  if (!lot) throw AppError.notFound('lot_code_not_found', `Lot ${q.lotCode} of ${item.sku} was not found.`, { params: { lot: q.lotCode, sku: item.sku } })
  return { item, lot, bin: null }
}
