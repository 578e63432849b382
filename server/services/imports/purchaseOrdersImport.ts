// Purchase orders already open with vendors when the business starts on Lumenyard: one row per line (the
// order's number, vendor and ship-to warehouse repeat on each), with what was already received, so "on
// order" (ordered − received on open orders) is right from day one. The units already received are in
// the opening stock, so no stock moves are written. New order numbers only; reversible while none of its
// orders has been received against, changed or cancelled since.
import { problem, type RowProblem } from '../../../shared/errors/errorCodes.js'
import { orderTotal } from '../../../shared/purchasing/poMoney.js'
import { AppError } from '../../errors.js'
import type { CheckedRow, DataImportDefinition } from './dataImports.js'
import { cellText, distinctOf, headerOf, inChunks, itemsBySku, marks, namedItem, namedWarehouse, parserProblems, validDay, warehousesByCode } from './importFacts.js'
import type { ImportSpec } from './importTypes.js'

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

interface Line { itemId: number; description: string; qty: number; received: number; unitCost: string }
interface Order { number: string; vendorId: number; warehouseId: number; orderedOn: string; expected: string | null; lines: Line[] }

const col = headerOf(PURCHASE_ORDERS_SPEC)

export const purchaseOrdersImport: DataImportDefinition<Order> = {
  kind: 'purchase_orders',
  spec: PURCHASE_ORDERS_SPEC,
  async check(em, sheet) {
    const items = await itemsBySku(em, distinctOf(sheet, 'sku'))
    const names = new Map((await inChunks([...items.values()].map((i) => i.id), (c) => em.query(`SELECT id, name FROM items WHERE id IN (${marks(c.length)})`, c) as Promise<{ id: number; name: string }[]>)).map((i) => [i.id, i.name]))
    const warehouses = await warehousesByCode(em)
    const vendorRows: { id: number; code: string }[] = await em.query('SELECT id, code FROM vendors')
    const vendors = new Map(vendorRows.map((v) => [v.code.toUpperCase(), v.id]))
    const numbers = distinctOf(sheet, 'number')
    const taken = new Set((await inChunks(numbers, (c) => em.query(`SELECT number FROM purchase_orders WHERE number IN (${marks(c.length)})`, c) as Promise<{ number: string }[]>)).map((r) => r.number.toUpperCase()))
    const orders = new Map<string, Order & { firstRow: number; rows: CheckedRow<Order>[] }>()
    const today = new Date().toISOString().slice(0, 10)
    const problemsOf = parserProblems(sheet, col)
    const checked = sheet.rows.map((r): CheckedRow<Order> => {
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
      const row: CheckedRow<Order> = { preview, write: null }
      if (!errors.length && vendorId && warehouse && item && qty !== null && cost !== null) {
        const key = number.toUpperCase()
        const order = orders.get(key)
        if (!order) {
          orders.set(key, { number, vendorId, warehouseId: warehouse.id, orderedOn, expected, lines: [], firstRow: r.row, rows: [row] })
        } else if (order.vendorId !== vendorId || order.warehouseId !== warehouse.id) {
          errors.push({ column: null, problem: problem('import_order_differs', { row: order.firstRow }) })
        } else order.rows.push(row)
        if (!errors.length) orders.get(key)!.lines.push({ itemId: item.id, description: names.get(item.id) ?? sku, qty, received, unitCost: cost })
      }
      return row
    })
    // One write per order, on its first row; an order whose every line is received is not open.
    for (const order of orders.values()) {
      if (order.lines.every((l) => l.received >= l.qty)) {
        order.rows[0].preview.errors.push({ column: col('received'), problem: problem('import_order_closed', { number: order.number }) })
        continue
      }
      const { firstRow: _f, rows, ...write } = order
      rows[0].write = write
    }
    return checked
  },
  async write(em, actor, importId, orders) {
    let lines = 0
    for (const o of orders) {
      const status = o.lines.some((l) => l.received > 0) ? 'partly_received' : 'sent'
      const total = orderTotal(o.lines.map((l) => ({ unitCost: l.unitCost, qtyOrdered: l.qty })))
      const res: { insertId: number } = await em.query(
        `INSERT INTO purchase_orders (number, vendor_id, warehouse_id, status, expected_date, total, created_by, approved_by, approved_at, sent_by, sent_at, import_id)
         VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        [o.number, o.vendorId, o.warehouseId, status, o.expected, total, actor.userId, actor.userId, `${o.orderedOn} 00:00:00`, actor.userId, `${o.orderedOn} 00:00:00`, importId],
      )
      await em.query(
        `INSERT INTO purchase_order_lines (po_id, line_no, item_id, description, pack_qty, packs_ordered, qty_ordered, qty_received, unit_cost)
         VALUES ${o.lines.map(() => '(?, ?, ?, ?, 1, ?, ?, ?, ?)').join(', ')}`,
        o.lines.flatMap((l, i) => [res.insertId, i + 1, l.itemId, l.description.slice(0, 200), l.qty, l.qty, l.received, l.unitCost]),
      )
      lines += o.lines.length
      // An imported number in Lumenyard's own form moves that year's counter past it, so new orders never take it.
      const own = /^PO-(\d{4})-(\d{5})$/.exec(o.number)
      if (own) {
        await em.query('INSERT INTO po_number_counters (po_year, last_number) VALUES (?, ?) ON DUPLICATE KEY UPDATE last_number = GREATEST(last_number, VALUES(last_number))', [Number(own[1]), Number(own[2])])
      }
    }
    return { orders: orders.length, lines, units: orders.reduce((n, o) => n + o.lines.reduce((m, l) => m + l.qty - l.received, 0), 0) }
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

