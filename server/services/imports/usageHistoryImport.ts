// Usage from before Lumenyard: past issues or sales per item, warehouse and day, or per month (spread over
// its days). Kept in usage_history, which the reorder statistics read beside the ledger's issues; never
// stock moves, so no balance changes. Reversing the import deletes its rows (nothing else writes them).
import type { EntityManager } from 'typeorm'
import { problem, type RowProblem } from '../../../shared/errors/errorCodes.js'
import { dayNumber } from '../../../shared/inventory/demand.js'
import { daysInMonth, spreadOverMonth } from '../../../shared/inventory/usageSpread.js'
import type { CheckedRow, DataImportDefinition } from './dataImports.js'
import { insertRows } from './recordsImport.js'
import { cellText, distinctOf, headerOf, inChunks, itemsBySku, marks, namedItem, namedWarehouse, notOwn, parserProblems, repeatedRows, rowQuantity, warehousesByCode } from './importFacts.js'
import type { ImportSpec, ParsedSheet } from './importTypes.js'

export const USAGE_HISTORY_SPEC: ImportSpec = {
  columns: [
    { key: 'sku', header: 'SKU', aliases: ['Item SKU'], required: true, kind: 'text' },
    { key: 'warehouse', header: 'Warehouse', aliases: ['Warehouse code'], required: true, kind: 'text' },
    { key: 'day', header: 'Day', aliases: ['Date'], kind: 'text' },
    { key: 'month', header: 'Month', kind: 'text' },
    { key: 'quantity', header: 'Quantity used', aliases: ['Quantity', 'Qty', 'Used', 'Sold'], required: true, kind: 'text' },
  ],
  ignore: ['Name', 'Item', 'Stock unit', 'Description', 'Note'],
  maxRows: 200_000,
  maxColumns: 30,
}

export const USAGE_HISTORY_GUIDE: Record<string, string> = {
  sku: 'An item already in the catalog.',
  warehouse: 'The warehouse the units left from (its code).',
  day: 'The day of use, as YYYY-MM-DD. Give a day or a month on each row, not both.',
  month: 'A whole month, as YYYY-MM, when you only know monthly totals: the quantity is spread over its days in whole units. Only months already over.',
  quantity: 'Units issued or sold, in the item\'s stock unit or packs ("3 cases"). A 0 row is skipped.',
}

/** A row's days to write; `spreadMonth` the month (YYYY-MM) when the row gave a month total, null for a day. */
type Write = { itemId: number; warehouseId: number; days: { date: string; qty: number }[]; spreadMonth: string | null }

/**
 * What a pass carries from chunk to chunk: the (item, warehouse, period) keys seen, for repeats, and for each item,
 * warehouse and month the first row that named it and whether by the month or by a day of it (one key a month).
 */
interface Carried { repeated: ReturnType<typeof repeatedRows>; months: Map<string, { row: number; byMonth: boolean }> }

const col = headerOf(USAGE_HISTORY_SPEC)
const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/

function validDay(text: string): boolean {
  if (!ISO_DAY.test(text)) return false
  try {
    dayNumber(text)
    return true
  } catch {
    return false
  }
}

/**
 * The item, warehouse and periods already held in usage history for these items, as `item:warehouse:YYYY-MM-DD`
 * and `item:warehouse:YYYY-MM` keys, and `item:warehouse:YYYY-MM spread` for a month brought in as a month total
 * (whose days without a unit hold no row, yet are counted in its total).
 */
async function heldUsage(em: EntityManager, itemIds: number[], importId: number | null): Promise<Set<string>> {
  const [own, ownId] = notOwn('import_id', importId)
  const rows = await inChunks(itemIds, (c) => em.query(
    `SELECT DISTINCT item_id, warehouse_id, DATE_FORMAT(day, '%Y-%m-%d') AS day, spread_month FROM usage_history
      WHERE item_id IN (${marks(c.length)})${own}`, [...c, ownId],
  ) as Promise<{ item_id: number; warehouse_id: number; day: string; spread_month: string | null }[]>)
  const keys = new Set<string>()
  for (const r of rows) {
    keys.add(`${r.item_id}:${r.warehouse_id}:${r.day}`)
    keys.add(`${r.item_id}:${r.warehouse_id}:${r.day.slice(0, 7)}`)
    if (r.spread_month) keys.add(`${r.item_id}:${r.warehouse_id}:${r.spread_month} spread`)
  }
  return keys
}

async function checkChunk(em: EntityManager, importId: number | null, sheet: ParsedSheet, carried: Carried): Promise<CheckedRow<Write>[]> {
  const items = await itemsBySku(em, distinctOf(sheet, 'sku'))
  const warehouses = await warehousesByCode(em)
  const today = new Date().toISOString().slice(0, 10)
  const held = await heldUsage(em, [...new Set([...items.values()].map((i) => i.id))], importId)
  const problemsOf = parserProblems(sheet, col)
  return sheet.rows.map((r): CheckedRow<Write> => {
    const errors = problemsOf(r.row)
    const add = (key: string, p: RowProblem['problem']) => errors.push({ column: col(key), problem: p })
    const { sku, item } = namedItem(r.values.sku, items, { add })
    const { warehouse } = namedWarehouse(r.values.warehouse, warehouses, { add })
    const dayText = cellText(r.values.day)
    // A month typed into a spreadsheet often becomes a date (its first day): read its month.
    const monthText = cellText(r.values.month).slice(0, 7)
    let when: string | null = null
    if (dayText && monthText) add('day', problem('import_usage_day_or_month'))
    else if (!dayText && !monthText) add('day', problem('import_usage_day_or_month'))
    else if (dayText) {
      if (!validDay(dayText)) add('day', problem('invalid_date'))
      else if (dayText > today) add('day', problem('day_after_today', { today }))
      else when = dayText
    } else {
      if (!/^\d{4}-(0[1-9]|1[0-2])$/.test(monthText)) add('month', problem('invalid_date'))
      else if (`${monthText}-${String(daysInMonth(monthText)).padStart(2, '0')}` > today) add('month', problem('day_after_today', { today }))
      else when = monthText
    }
    const qty = rowQuantity(r.values.quantity, item, sku, 100_000_000, { add })
    // A month total ('YYYY-MM') or a day ('YYYY-MM-DD').
    const byMonth = when?.length === 7
    if (item && warehouse && when) {
      const key = `${item.id}:${warehouse.id}:${when}`
      const month = when.slice(0, 7)
      const monthKey = `${item.id}:${warehouse.id}:${month}`
      const again = carried.repeated(key, r.row)
      if (again) errors.push(again)
      // A month given as a total and a day of it given too (in either order) would count that day's use twice.
      const first = carried.months.get(monthKey)
      if (!first) carried.months.set(monthKey, { row: r.row, byMonth })
      else if (first.byMonth !== byMonth) add(byMonth ? 'month' : 'day', problem('import_usage_day_and_month', { sku, warehouse: warehouse.code, month, row: first.row }))
      // History already held for that day (or any day of that month) is never added to a second time, nor a day of
      // a month held as a total.
      if (held.has(key)) add(byMonth ? 'month' : 'day', problem('import_usage_overlap', { sku, warehouse: warehouse.code, period: when }))
      else if (!byMonth && held.has(`${monthKey} spread`)) add('day', problem('import_usage_month_held', { sku, warehouse: warehouse.code, month }))
    }
    const preview = { row: r.row, label: sku || null, place: warehouse && when ? `${warehouse.code} ${when}` : null, qty, errors }
    if (errors.length || !item || !warehouse || !when || !qty) return { preview, write: null }
    const days = byMonth ? spreadOverMonth(when, qty) : [{ date: when, qty }]
    return { preview, write: { itemId: item.id, warehouseId: warehouse.id, days, spreadMonth: byMonth ? when : null } }
  })
}

export const usageHistoryImport: DataImportDefinition<Write> = {
  kind: 'usage_history',
  spec: USAGE_HISTORY_SPEC,
  // Each chunk looks up its own items and the history they already have; only the (item, warehouse, period) keys
  // and months seen so far carry over, for repeats. Every row is written on its own, so a chunk's rows go out with
  // it (and the history a commit's earlier chunks wrote is not held from before).
  checker(em, importId) {
    const carried: Carried = { repeated: repeatedRows(), months: new Map() }
    return { check: (sheet) => checkChunk(em, importId, sheet, carried) }
  },
  async write(em, _actor, importId, rows) {
    const flat = rows.flatMap((r) => r.days.map((d) => [r.itemId, r.warehouseId, d.date, d.qty, r.spreadMonth]))
    await insertRows(em, 'usage_history', ['item_id', 'warehouse_id', 'day', 'qty', 'spread_month'], importId, flat, (values) => values, 1000)
    return { lines: rows.length, units: rows.reduce((n, r) => n + r.days.reduce((m, d) => m + d.qty, 0), 0), days: flat.length }
  },
  async reverse(em, _actor, importId) {
    await em.query('DELETE FROM usage_history WHERE import_id = ?', [importId])
  },
}
