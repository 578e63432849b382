// Reorder test fixture: invented items, a vendor and a known usage history written straight into the ledger
// tables (the catalog and receiving APIs belong to other features). The ledger stays consistent: each line's
// moves add up to its balance. Every name carries a fresh tag, so runs and files never collide.
import { randomBytes } from 'node:crypto'
import type { DataSource } from 'typeorm'

export const WINDOW_DAYS = 180
const DAY_MS = 86_400_000

export interface ReorderFixture {
  tag: string
  warehouseId: number
  warehouseCode: string
  vendorId: number
  /** The block with a known history, a preferred vendor and observed lead times. */
  itemId: number
  sku: string
  /** Daily use over the default window, index 0 = the window's first day (zeros included). */
  series: number[]
  windowStart: string
  onHand: number
  reserved: number
  onOrder: number
  /** Observed order-to-receipt days of the three received purchase orders. */
  leadTimes: number[]
  /** Grout with stock and no use at all. */
  deadItemId: number
  /** An accessory with stock whose only use was 250 days ago. */
  oldUseItemId: number
  oldUseDaysAgo: number
  /** Sealant used every day, out of stock, no vendor item. */
  noVendorItemId: number
}

const tagOf = () => randomBytes(3).toString('hex').toUpperCase()
export const isoDay = (ms: number) => new Date(ms).toISOString().slice(0, 10)
const todayMs = () => Date.parse(`${isoDay(Date.now())}T00:00:00Z`)
/** A moment on the day `daysAgo` before today (UTC), at the given hour. */
const at = (daysAgo: number, hour = 10) => new Date(todayMs() - daysAgo * DAY_MS + hour * 3_600_000).toISOString().slice(0, 23).replace('T', ' ')

async function insertId(ds: DataSource, sql: string, params: unknown[]): Promise<number> {
  return Number(((await ds.query(sql, params)) as { insertId: number | string }).insertId)
}

/** Invented, repeatable usage: about half the days without use, heavier in the second half. */
export function knownSeries(days = WINDOW_DAYS, seed = 20251): number[] {
  let s = seed
  const next = () => (s = (s * 1103515245 + 12345) % 2147483648) / 2147483648
  return Array.from({ length: days }, (_, t) => (next() < 0.5 ? 0 : 1 + Math.floor(next() * (t < days / 2 ? 8 : 12))))
}

interface MoveRow { at: string; type: string; itemId: number; qty: number; docType?: string; docId?: number }

async function insertMoves(ds: DataSource, warehouseId: number, binId: number, moves: MoveRow[]): Promise<void> {
  const values = moves.map(() => "(?, ?, ?, ?, ?, NULL, ?, ?, ?, UUID())").join(',')
  const params = moves.flatMap((m) => [m.at, m.type, m.itemId, warehouseId, binId, m.qty, m.docType ?? null, m.docId ?? null])
  await ds.query(`INSERT INTO stock_moves (at, move_type, item_id, warehouse_id, bin_id, lot_id, qty, doc_type, doc_id, batch_id) VALUES ${values}`, params)
}

async function insertBalance(ds: DataSource, itemId: number, warehouseId: number, binId: number, onHand: number, reserved: number) {
  await ds.query('INSERT INTO stock_balances (item_id, warehouse_id, bin_id, on_hand, reserved) VALUES (?, ?, ?, ?, ?)', [itemId, warehouseId, binId, onHand, reserved])
}

/** The main block's usage: each day of use as an issue, split with a pick on some days. */
function usageMoves(itemId: number, series: number[]): MoveRow[] {
  const moves: MoveRow[] = []
  series.forEach((qty, t) => {
    if (qty === 0) return
    const daysAgo = series.length - 1 - t
    if (qty > 3 && t % 3 === 0) {
      moves.push({ at: at(daysAgo, 8), type: 'pick', itemId, qty: -2 }, { at: at(daysAgo, 15), type: 'issue', itemId, qty: -(qty - 2) })
    } else moves.push({ at: at(daysAgo, 1), type: 'issue', itemId, qty: -qty })
  })
  return moves
}

async function purchaseOrders(ds: DataSource, tag: string, vendorId: number, warehouseId: number, itemId: number) {
  const po = (n: number, status: string, sentDaysAgo: number | null, approvedDaysAgo: number) => insertId(ds,
    `INSERT INTO purchase_orders (number, vendor_id, warehouse_id, status, approved_at, sent_at) VALUES (?, ?, ?, ?, ?, ?)`,
    [`RO${tag}-${n}`, vendorId, warehouseId, status, at(approvedDaysAgo, 9), sentDaysAgo === null ? null : at(sentDaysAgo, 9)])
  // Received orders: sent → first receipt after 9 and 13 days; one only approved (never marked sent) → 11 days.
  const received = [await po(1, 'received', 120, 121), await po(2, 'received', 80, 81), await po(3, 'received', null, 60)]
  const open = await po(4, 'sent', 5, 6)
  await ds.query(
    `INSERT INTO purchase_order_lines (po_id, line_no, item_id, description, pack_qty, packs_ordered, qty_ordered, unit_cost)
     VALUES (?, 1, ?, 'Test block', 48, 1, 48, 3.1000)`, [open, itemId])
  const receipts: MoveRow[] = [
    { at: at(120 - 9, 9), type: 'receipt', itemId, qty: 96, docType: 'purchase_order', docId: received[0] },
    { at: at(120 - 20, 9), type: 'receipt', itemId, qty: 48, docType: 'purchase_order', docId: received[0] },
    { at: at(80 - 13, 9), type: 'receipt', itemId, qty: 144, docType: 'purchase_order', docId: received[1] },
    { at: at(60 - 11, 9), type: 'receipt', itemId, qty: 96, docType: 'purchase_order', docId: received[2] },
  ]
  return { receipts, leadTimes: [9, 13, 11], onOrder: 48 }
}

async function sideItems(ds: DataSource, tag: string, warehouseId: number, binId: number) {
  const item = (suffix: string, family: string) => insertId(ds,
    `INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, ?, ?, 'each', 2.0000)`, [`RO${tag}-${suffix}`, `Test ${family}`, family])
  const deadItemId = await item('GRT', 'grout')
  const oldUseItemId = await item('ACC', 'accessory')
  const noVendorItemId = await item('SLT', 'sealant')
  const oldUseDaysAgo = 250
  await insertMoves(ds, warehouseId, binId, [
    { at: at(400), type: 'receipt', itemId: deadItemId, qty: 30 },
    { at: at(400), type: 'receipt', itemId: oldUseItemId, qty: 25 },
    { at: at(oldUseDaysAgo), type: 'issue', itemId: oldUseItemId, qty: -5 },
    { at: at(60), type: 'receipt', itemId: noVendorItemId, qty: 60 },
    ...Array.from({ length: 60 }, (_, d) => ({ at: at(d), type: 'issue', itemId: noVendorItemId, qty: -1 })),
  ])
  await insertBalance(ds, deadItemId, warehouseId, binId, 30, 0)
  await insertBalance(ds, oldUseItemId, warehouseId, binId, 20, 0)
  return { deadItemId, oldUseItemId, noVendorItemId, oldUseDaysAgo }
}

export async function createReorderFixture(ds: DataSource): Promise<ReorderFixture> {
  const tag = tagOf()
  const warehouseCode = `RO${tag}`
  const warehouseId = await insertId(ds, 'INSERT INTO warehouses (code, name) VALUES (?, ?)', [warehouseCode, `Test reorder yard ${tag}`])
  const binId = await insertId(ds, `INSERT INTO bins (warehouse_id, code, kind) VALUES (?, 'A-01-1', 'storage')`, [warehouseId])
  const sku = `RO${tag}-BLK`
  const itemId = await insertId(ds, `INSERT INTO items (sku, name, family, stock_unit, cost) VALUES (?, 'Test 8 in clear block', 'glass_block', 'each', 3.0000)`, [sku])
  const vendorId = await insertId(ds, 'INSERT INTO vendors (code, name, lead_time_days) VALUES (?, ?, 10)', [`RO${tag}`, `Test glassworks ${tag}`])
  await ds.query(`INSERT INTO vendor_items (vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, lead_time_days, preferred)
                  VALUES (?, ?, ?, 48, 96, 3.1000, 12, 1)`, [vendorId, itemId, `V-${tag}`])
  await ds.query(`INSERT INTO item_warehouses (item_id, warehouse_id, avg_cost) VALUES (?, ?, 3.2000)`, [itemId, warehouseId])
  const series = knownSeries()
  const used = series.reduce((a, b) => a + b, 0)
  const { receipts, leadTimes, onOrder } = await purchaseOrders(ds, tag, vendorId, warehouseId, itemId)
  const received = receipts.reduce((a, m) => a + m.qty, 0)
  const onHand = 12
  const reserved = 10
  // Not usage: before the window, other move types. The opening receipt makes the moves add up to on hand.
  const other: MoveRow[] = [
    { at: at(WINDOW_DAYS), type: 'issue', itemId, qty: -500 },
    { at: at(30), type: 'adjustment', itemId, qty: -3 },
    { at: at(20), type: 'transfer_out', itemId, qty: -5 },
  ]
  const opening = onHand + used + 500 + 3 + 5 - received
  await insertMoves(ds, warehouseId, binId, [{ at: at(365), type: 'receipt', itemId, qty: opening }, ...receipts, ...other, ...usageMoves(itemId, series)])
  await insertBalance(ds, itemId, warehouseId, binId, onHand, reserved)
  const side = await sideItems(ds, tag, warehouseId, binId)
  return {
    tag, warehouseId, warehouseCode, vendorId, itemId, sku, series, windowStart: isoDay(todayMs() - (WINDOW_DAYS - 1) * DAY_MS),
    onHand, reserved, onOrder, leadTimes, ...side,
  }
}
