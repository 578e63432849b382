// Invented bench data, generated fast: 5,000 items × 3 warehouses, 20,000 balances (every item in each
// warehouse's first bin, and a second bin in the first warehouse) and 1,000,000 ledger moves over a year,
// written as multi-row INSERTs of 5,000 rows with numbers inlined (no escaping needed) on a few connections.
// Item popularity is skewed (a few fast movers, a long tail) so the ABC classes and statuses are realistic.
import { randomUUID } from 'node:crypto'
import type { DataSource } from 'typeorm'
import { withCheckDigit } from '../../shared/barcode/checkDigit.js'
import { ITEM_FAMILIES } from '../../shared/catalog.js'

export const BENCH = { items: 5000, warehouses: 3, balances: 20_000, vendors: 60, moves: 1_000_000, days: 365, chunk: 5000, writers: 3 }
const DAY_MS = 86_400_000

/** Small seeded generator (mulberry32) so every bench run builds the same data. */
function rng(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

async function inChunks(ds: DataSource, table: string, columns: string, rows: string[]): Promise<void> {
  const chunks: string[][] = []
  for (let i = 0; i < rows.length; i += BENCH.chunk) chunks.push(rows.slice(i, i + BENCH.chunk))
  let next = 0
  const writer = async () => {
    while (next < chunks.length) await ds.query(`INSERT INTO ${table} (${columns}) VALUES ${chunks[next++].join(',')}`)
  }
  await Promise.all(Array.from({ length: BENCH.writers }, writer))
}

async function catalog(ds: DataSource, random: () => number): Promise<void> {
  await inChunks(ds, 'warehouses', 'id, code, name', [1, 2, 3].map((i) => `(${i}, 'BW${i}', 'Bench yard ${i}')`))
  await inChunks(ds, 'bins', 'id, warehouse_id, code', [...[1, 2, 3].map((i) => `(${i}, ${i}, 'A-01-1')`), `(4, 1, 'A-01-2')`])
  await inChunks(ds, 'vendors', 'id, code, name, lead_time_days',
    Array.from({ length: BENCH.vendors }, (_, v) => `(${v + 1}, 'BV${v + 1}', 'Bench vendor ${v + 1}', ${7 + (v % 4) * 7})`))
  const items: string[] = []
  const vendorItems: string[] = []
  for (let i = 1; i <= BENCH.items; i++) {
    const cost = (0.5 + random() * 60).toFixed(4)
    // GTIN-13s in the restricted-circulation prefix 20, stored as GTIN-14 as the catalog form stores them.
    const gtin = '0' + withCheckDigit(`20${String(i).padStart(10, '0')}`)
    items.push(`(${i}, 'BI-${i}', 'Bench item ${i}', '${ITEM_FAMILIES[i % 7]}', 'each', ${cost}, '${gtin}')`)
    const pack = [1, 6, 12, 24, 48][i % 5]
    vendorItems.push(`(${1 + (i % BENCH.vendors)}, ${i}, 'V${i}', ${pack}, ${pack * (1 + (i % 3))}, ${cost}, ${i % 4 === 0 ? 'NULL' : 5 + (i % 20)}, 1)`)
    if (i % 3 === 0) vendorItems.push(`(${1 + ((i + 7) % BENCH.vendors)}, ${i}, 'W${i}', 1, 1, ${(Number(cost) * 1.1).toFixed(4)}, 30, 0)`)
  }
  await inChunks(ds, 'items', 'id, sku, name, family, stock_unit, cost, gtin', items)
  await inChunks(ds, 'vendor_items', 'vendor_id, item_id, vendor_sku, pack_qty, min_order_qty, unit_cost, lead_time_days, preferred', vendorItems)
}

/** Balances and moving-average costs for every item in every warehouse. */
async function positions(ds: DataSource, random: () => number): Promise<void> {
  const balances: string[] = []
  const costs: string[] = []
  for (let i = 1; i <= BENCH.items; i++) {
    for (let w = 1; w <= BENCH.warehouses; w++) {
      const onHand = Math.floor(random() * 400)
      balances.push(`(${i}, ${w}, ${w}, ${onHand}, ${Math.floor(onHand * random() * 0.2)})`)
      costs.push(`(${i}, ${w}, ${(0.5 + random() * 60).toFixed(4)})`)
    }
    balances.push(`(${i}, 1, 4, ${Math.floor(random() * 100)}, 0)`)
  }
  await inChunks(ds, 'stock_balances', 'item_id, warehouse_id, bin_id, on_hand, reserved', balances)
  await inChunks(ds, 'item_warehouses', 'item_id, warehouse_id, avg_cost', costs)
}

const stamp = (ms: number) => new Date(ms).toISOString().slice(0, 23).replace('T', ' ')

/** 1,000,000 moves: 90 % issues and picks on skewed items, the rest receipts and adjustments. */
function moveRows(random: () => number, start: number): string[] {
  const rows: string[] = new Array(BENCH.moves)
  let batch = randomUUID()
  for (let n = 0; n < BENCH.moves; n++) {
    if (n % BENCH.chunk === 0) batch = randomUUID()
    const item = 1 + Math.floor(BENCH.items * random() ** 2.2)
    const wh = 1 + Math.floor(random() * BENCH.warehouses)
    const at = stamp(start + Math.floor(random() * BENCH.days * DAY_MS))
    const kind = random()
    const type = kind < 0.55 ? 'issue' : kind < 0.9 ? 'pick' : kind < 0.97 ? 'receipt' : 'adjustment'
    const qty = type === 'receipt' ? 24 + Math.floor(random() * 200) : -(1 + Math.floor(random() * 12))
    rows[n] = `('${at}','${type}',${item},${wh},${wh},${qty},'${batch}')`
  }
  return rows
}

/** A few hundred received purchase orders (observed lead times) and some open ones (on order). */
async function purchaseOrders(ds: DataSource, random: () => number, start: number): Promise<void> {
  const orders: string[] = []
  const lines: string[] = []
  const receipts: string[] = []
  for (let po = 1; po <= 600; po++) {
    const item = 1 + Math.floor(random() * 300)
    const open = po > 500
    const sent = start + Math.floor(random() * (BENCH.days - 40) * DAY_MS)
    orders.push(`(${po}, 'BPO-${po}', ${1 + (item % BENCH.vendors)}, ${1 + (po % 3)}, '${open ? 'sent' : 'received'}', '${stamp(sent)}')`)
    lines.push(`(${po}, 1, ${item}, 'Bench line', 1, 50, 50, ${open ? 0 : 50}, 1.0000)`)
    if (!open) receipts.push(`('${stamp(sent + (5 + random() * 20) * DAY_MS)}','receipt',${item},${1 + (po % 3)},${1 + (po % 3)},50,'purchase_order',${po},'${randomUUID()}')`)
  }
  await inChunks(ds, 'purchase_orders', 'id, number, vendor_id, warehouse_id, status, sent_at', orders)
  await inChunks(ds, 'purchase_order_lines', 'po_id, line_no, item_id, description, pack_qty, packs_ordered, qty_ordered, qty_received, unit_cost', lines)
  await inChunks(ds, 'stock_moves', 'at, move_type, item_id, warehouse_id, bin_id, qty, doc_type, doc_id, batch_id', receipts)
}

async function policies(ds: DataSource): Promise<void> {
  await ds.query(`INSERT INTO reorder_policies (scope, scope_key, family, service_level, dead_stock_days) VALUES
    ('family', 'glass_block', 'glass_block', 0.9700, NULL), ('family', 'grout', 'grout', NULL, 120)`)
  await ds.query(`INSERT INTO reorder_policies (scope, scope_key, abc_class, service_level) VALUES ('abc', 'A', 'A', 0.9800), ('abc', 'C', 'C', 0.9000)`)
  await ds.query(`INSERT INTO reorder_policies (scope, scope_key, item_id, warehouse_id, override_reorder_point, override_reason) VALUES
    ('item_warehouse', '1:1', 1, 1, 900, 'bench: a standing contract')`)
}

export async function generateBenchData(ds: DataSource): Promise<{ seconds: number }> {
  const started = Date.now()
  const random = rng(20251201)
  const start = Date.parse(`${new Date().toISOString().slice(0, 10)}T00:00:00Z`) - (BENCH.days - 1) * DAY_MS
  await catalog(ds, random)
  await positions(ds, random)
  await inChunks(ds, 'stock_moves', 'at, move_type, item_id, warehouse_id, bin_id, qty, batch_id', moveRows(random, start))
  await purchaseOrders(ds, random, start)
  await policies(ds)
  await ds.query('ANALYZE TABLE stock_moves, stock_balances, items, vendor_items')
  return { seconds: (Date.now() - started) / 1000 }
}
