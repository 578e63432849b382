// Purchase orders already open with vendors when the business starts on Lumenyard: one row per line (the
// order's number, vendor and ship-to warehouse repeat on each), with what was already received, so "on
// order" (ordered − received on open orders) is right from day one. The units already received are in
// the opening stock, so no stock moves are written. New order numbers only; reversible while none of its
// orders has been received against, changed or cancelled since.
import type { EntityManager } from 'typeorm'
import { problem, type RowProblem } from '../../../shared/errors/errorCodes.js'
import { addMoney, roundMoney } from '../../../shared/money.js'
import { lineTotal } from '../../../shared/purchasing/poMoney.js'
import { AppError } from '../../errors.js'
import type { CheckedRow, DataImportDefinition } from './dataImports.js'
import { chunked } from './recordsImport.js'
import { cellText, distinctOf, headerOf, heldValues, inChunks, itemsBySku, marks, namedItem, namedWarehouse, parserProblems, validDay, warehousesByCode } from './importFacts.js'
import type { ImportSpec, ParsedSheet } from './importTypes.js'

export const PURCHASE_ORDERS_SPEC: ImportSpec = {
  columns: [
    { key: 'number', header: 'Order number', aliases: ['PO number', 'PO'], required: true, kind: 'text' },
    { key: 'vendor', header: 'Vendor code', aliases: ['Vendor'], required: true, kind: 'text' },
    { key: 'warehouse', header: 'Ship to warehouse', aliases: ['Warehouse'], required: true, kind: 'text' },
    { key: 'orderedOn', header: 'Ordered on', aliases: ['Sent on', 'Order date'], required: true, kind: 'text' },
    { key: 'expected', header: 'Expected', aliases: ['Expected date'], kind: 'text' },
    { key: 'sku', header: 'SKU', required: true, kind: 'text' },
    { key: 'qty', header: 'Quantity ordered', aliases: ['Ordered'], required: true, kind: 'integer' },
    { key: 'received', header: 'Received so far', aliases: ['Received'], kind: 'integer' },
    { key: 'unitCost', header: 'Cost per stock unit', aliases: ['Unit cost', 'Cost'], required: true, kind: 'decimal' },
  ],
  ignore: ['Name', 'Item', 'Description', 'Status', 'Line total', 'Notes'],
  maxRows: 20_000,
  maxColumns: 30,
}

export const PURCHASE_ORDERS_GUIDE: Record<string, string> = {
  number: 'Your order number; every line of one order carries it. A number already in Lumenyard is refused.',
  vendor: 'A vendor code, as set up under Vendors (or brought in with the vendors import).',
  warehouse: 'Where the order is to arrive (warehouse code). The same on every line of an order.',
  orderedOn: 'The day the order went to the vendor, YYYY-MM-DD. Lead times are measured from it.',
  expected: 'When the vendor said it arrives, YYYY-MM-DD (optional).',
  qty: 'Stock units ordered on the line.',
  received: 'Stock units already received (they are counted in your opening stock). An order fully received is not open: leave it out.',
  unitCost: 'The price agreed with the vendor per stock unit, up to 4 decimals.',
}

interface Header { number: string; vendorId: number; warehouseId: number; orderedOn: string; expected: string | null }
/**
 * One line of an order, written with its chunk. It carries its order's header (the first line writes it), its line
 * number, and the order's total and received state as they stand with this line (the last line of a chunk sets them).
 */
interface LineWrite extends Header {
  lineNo: number
  itemId: number; description: string; qty: number; received: number; unitCost: string
  total: string
  anyReceived: boolean
}

type LineFacts = Pick<LineWrite, 'itemId' | 'description' | 'qty' | 'received' | 'unitCost'>

/**
 * An order as a pass carries it from chunk to chunk: its header and what its lines so far add up to, never the lines.
 * Until one of its lines is still to come in, its lines are held back (`waiting`): an order whose every line is
 * received is not open, and that is known only at the end of the file.
 */
interface OrderSoFar extends Header {
  firstRow: number
  lines: number
  total: string
  anyReceived: boolean
  waiting: { row: CheckedRow<LineWrite>; line: LineFacts }[] | null
}

const col = headerOf(PURCHASE_ORDERS_SPEC)

/** A chunk's rows against what it names; an order number a commit's earlier chunks wrote is the file's own. */
async function checkChunk(em: EntityManager, importId: number | null, sheet: ParsedSheet, orders: Map<string, OrderSoFar>): Promise<CheckedRow<LineWrite>[]> {
  const items = await itemsBySku(em, distinctOf(sheet, 'sku'))
  const names = new Map((await inChunks([...items.values()].map((i) => i.id), (c) => em.query(`SELECT id, name FROM items WHERE id IN (${marks(c.length)})`, c) as Promise<{ id: number; name: string }[]>)).map((i) => [i.id, i.name]))
  const warehouses = await warehousesByCode(em)
  const vendorRows = await inChunks(distinctOf(sheet, 'vendor'), (c) => em.query(`SELECT id, code FROM vendors WHERE code IN (${marks(c.length)})`, c) as Promise<{ id: number; code: string }[]>)
  const vendors = new Map(vendorRows.map((v) => [v.code.toUpperCase(), v.id]))
  const taken = await heldValues(em, 'purchase_orders', 'number', distinctOf(sheet, 'number'), importId)
  const today = new Date().toISOString().slice(0, 10)
  const problemsOf = parserProblems(sheet, col)
  const out: CheckedRow<LineWrite>[] = []
  for (const r of sheet.rows) {
    const errors = problemsOf(r.row)
    const add = (key: string, p: RowProblem['problem']) => errors.push({ column: col(key), problem: p })
    const number = cellText(r.values.number)
    if (number && taken.has(number.toUpperCase())) add('number', problem('import_code_exists', { code: number }))
    if (number.length > 20) add('number', problem('too_long', { max: 20 }))
    const vendorCode = cellText(r.values.vendor)
    const vendorId = vendors.get(vendorCode.toUpperCase())
    if (vendorCode && !vendorId) add('vendor', problem('import_vendor_unknown', { vendor: vendorCode }))
    const { warehouse } = namedWarehouse(r.values.warehouse, warehouses, { add })
    const orderedOn = cellText(r.values.orderedOn).slice(0, 10)
    if (orderedOn && !validDay(orderedOn)) add('orderedOn', problem('invalid_date'))
    else if (orderedOn > today) add('orderedOn', problem('day_after_today', { today }))
    const expected = cellText(r.values.expected).slice(0, 10) || null
    if (expected && !validDay(expected)) add('expected', problem('invalid_date'))
    const { sku, item } = namedItem(r.values.sku, items, { add })
    const qty = typeof r.values.qty === 'number' ? r.values.qty : null
    const received = typeof r.values.received === 'number' ? r.values.received : 0
    if (qty !== null && qty < 1) add('qty', problem('at_least', { min: 1 }))
    if (received < 0) add('received', problem('not_negative'))
    if (qty !== null && received > qty) add('received', problem('import_received_over', { ordered: qty }))
    const cost = typeof r.values.unitCost === 'string' ? r.values.unitCost : null
    if (cost !== null && (cost.startsWith('-') || (cost.split('.')[1] ?? '').length > 4 || Number(cost) >= 100_000_000)) add('unitCost', problem('cost_format'))
    const preview = { row: r.row, label: number || null, place: sku || null, qty, unitCost: cost, errors }
    const row: CheckedRow<LineWrite> = { preview, write: null }
    if (errors.length || !vendorId || !warehouse || !item || qty === null || cost === null) {
      out.push(row)
      continue
    }
    const key = number.toUpperCase()
    let order = orders.get(key)
    if (!order) {
      order = { number, vendorId, warehouseId: warehouse.id, orderedOn, expected, firstRow: r.row, lines: 0, total: '0.00', anyReceived: false, waiting: [] }
      orders.set(key, order)
    } else if (order.vendorId !== vendorId || order.warehouseId !== warehouse.id) {
      errors.push({ column: null, problem: problem('import_order_differs', { row: order.firstRow }) })
      out.push(row)
      continue
    }
    const line = { itemId: item.id, description: names.get(item.id) ?? sku, qty, received, unitCost: cost }
    // A line still to come in opens its order: the lines held back go out first, in the file's order, then this one.
    if (order.waiting && received < qty) {
      for (const w of order.waiting) out.push(placed(order, w.row, w.line))
      order.waiting = null
    }
    if (order.waiting) order.waiting.push({ row, line })
    else out.push(placed(order, row, line))
  }
  return out
}

/** The row with its line numbered and the order's total and received state as they stand with it. */
function placed(order: OrderSoFar, row: CheckedRow<LineWrite>, line: LineFacts): CheckedRow<LineWrite> {
  order.lines++
  // The order's total is the sum of its rounded line totals (poMoney), added a line at a time.
  order.total = roundMoney(addMoney(order.total, lineTotal(line.unitCost, line.qty)))
  order.anyReceived ||= line.received > 0
  const { number, vendorId, warehouseId, orderedOn, expected } = order
  row.write = { number, vendorId, warehouseId, orderedOn, expected, ...line, lineNo: order.lines, total: order.total, anyReceived: order.anyReceived }
  return row
}

export const purchaseOrdersImport: DataImportDefinition<LineWrite> = {
  kind: 'purchase_orders',
  spec: PURCHASE_ORDERS_SPEC,
  // Each line is checked with its chunk against the order it belongs to (carried as a header, however far apart its
  // lines stand in the file) and written with it; an order every line of which is received is found at the end.
  checker(em, importId) {
    const orders = new Map<string, OrderSoFar>()
    return {
      check: (sheet) => checkChunk(em, importId, sheet, orders),
      finish() {
        const closed: CheckedRow<LineWrite>[] = []
        for (const order of orders.values()) {
          if (!order.waiting) continue
          order.waiting[0].row.preview.errors.push({ column: col('received'), problem: problem('import_order_closed', { number: order.number }) })
          for (const w of order.waiting) closed.push(w.row)
          order.waiting = null
        }
        return closed
      },
    }
  },
  // A chunk's lines: the header of an order met for the first time, then the lines, then each order's total and
  // state as its last line in the chunk has them.
  async write(em, actor, importId, lines) {
    const byNumber = new Map<string, LineWrite[]>()
    for (const l of lines) byNumber.set(l.number.toUpperCase(), [...(byNumber.get(l.number.toUpperCase()) ?? []), l])
    let orders = 0
    for (const [, own] of byNumber) {
      const o = own[0]
      if (o.lineNo !== 1) continue
      orders++
      await em.query(
        `INSERT INTO purchase_orders (number, vendor_id, warehouse_id, status, expected_date, total, created_by, approved_by, approved_at, sent_by, sent_at, import_id)
         VALUES (?, ?, ?, 'sent', ?, 0, ?, ?, ?, ?, ?, ?)`,
        [o.number, o.vendorId, o.warehouseId, o.expected, actor.userId, actor.userId, `${o.orderedOn} 00:00:00`, actor.userId, `${o.orderedOn} 00:00:00`, importId],
      )
      // An imported number in Lumenyard's own form moves that year's counter past it, so new orders never take it.
      const ours = /^PO-(\d{4})-(\d{5})$/.exec(o.number)
      if (ours) {
        await em.query('INSERT INTO po_number_counters (po_year, last_number) VALUES (?, ?) ON DUPLICATE KEY UPDATE last_number = GREATEST(last_number, VALUES(last_number))', [Number(ours[1]), Number(ours[2])])
      }
    }
    const ids = new Map((await inChunks([...byNumber.values()].map((own) => own[0].number), (c) => em.query(
      `SELECT id, number FROM purchase_orders WHERE import_id = ? AND number IN (${marks(c.length)})`, [importId, ...c]) as Promise<{ id: number; number: string }[]>))
      .map((o) => [o.number.toUpperCase(), o.id]))
    await chunked(lines, 500, (part) => em.query(
      `INSERT INTO purchase_order_lines (po_id, line_no, item_id, description, pack_qty, packs_ordered, qty_ordered, qty_received, unit_cost)
       VALUES ${part.map(() => '(?, ?, ?, ?, 1, ?, ?, ?, ?)').join(', ')}`,
      part.flatMap((l) => [ids.get(l.number.toUpperCase()), l.lineNo, l.itemId, l.description.slice(0, 200), l.qty, l.qty, l.received, l.unitCost]),
    ))
    for (const [upper, own] of byNumber) {
      const last = own[own.length - 1]
      await em.query('UPDATE purchase_orders SET total = ?, status = ? WHERE id = ?', [last.total, last.anyReceived ? 'partly_received' : 'sent', ids.get(upper)])
    }
    return { orders, lines: lines.length, units: lines.reduce((n, l) => n + l.qty - l.received, 0) }
  },
  async reverse(em, _actor, importId) {
    // Untouched: still as imported (no receipt, no status change) — a receipt or a cancellation has to stay.
    const [moved]: { number: string }[] = await em.query(
      `SELECT o.number FROM purchase_orders o WHERE o.import_id = ?
         AND (EXISTS (SELECT 1 FROM po_receipts r WHERE r.po_id = o.id) OR o.status NOT IN ('sent', 'partly_received')) LIMIT 1 FOR UPDATE`,
      [importId],
    )
    if (moved) throw AppError.conflict('import_records_in_use', `Order ${moved.number} has moved on since the import; it can no longer be reversed as a whole.`, { params: { code: moved.number } })
    await em.query('DELETE l FROM purchase_order_lines l JOIN purchase_orders o ON o.id = l.po_id WHERE o.import_id = ?', [importId])
    await em.query('DELETE FROM purchase_orders WHERE import_id = ?', [importId])
  },
}

