// Demo step "stock history": simulates a year of stock movements in memory (DemoHistory) and writes
// lots, transfers, the ledger, balances and moving averages with bulk inserts. Runs once: it does
// nothing when the demo warehouses already have ledger rows.
import { In, type EntityManager } from 'typeorm'
import { Bin } from '../entities/Bin.js'
import { Item } from '../entities/Item.js'
import { User } from '../entities/User.js'
import { Vendor, VendorItem } from '../entities/Vendor.js'
import { Warehouse } from '../entities/Warehouse.js'
import { TRANSIT_BIN_CODE } from '../services/stock/stockTransfers.js'
import { bulkInsert } from './demoBulkInsert.js'
import { demoItems } from './demoCatalog.js'
import { DemoHistory } from './demoHistory.js'
import { planStock, type PlanItem, type PlanSource, type PlanWarehouse, type StockPlan } from './demoStockPlan.js'
import { DEMO_SITES, RECEIVING_BIN_CODE } from './demoWarehouses.js'

export const DEMO_SEED = 20240917

async function planItems(em: EntityManager): Promise<PlanItem[]> {
  const demo = demoItems()
  const items = await em.findBy(Item, { sku: In(demo.map((d) => d.row.sku)) })
  const sources = await em.findBy(VendorItem, { itemId: In(items.map((i) => i.id)), preferred: true })
  const vendors = new Map((await em.find(Vendor)).map((v) => [v.id, v]))
  const bySku = new Map(demo.map((d) => [d.row.sku, d]))
  return items.map((item) => {
    const vi = sources.find((s) => s.itemId === item.id)
    const source: PlanSource | null = vi
      ? { vendorId: vi.vendorId, unitCost: vi.unitCost, leadDays: vi.leadTimeDays ?? vendors.get(vi.vendorId)?.leadTimeDays ?? 14, packQty: vi.packQty, minOrderQty: vi.minOrderQty }
      : null
    return { id: item.id, demo: bySku.get(item.sku)!, source }
  })
}

async function planWarehouses(em: EntityManager): Promise<PlanWarehouse[] | null> {
  const warehouses = await em.findBy(Warehouse, { code: In(DEMO_SITES.map((s) => s.code)) })
  if (warehouses.length !== DEMO_SITES.length) return null
  const bins = await em.find(Bin, { where: { warehouseId: In(warehouses.map((w) => w.id)) }, order: { code: 'ASC' } })
  return DEMO_SITES.map((site) => {
    const wh = warehouses.find((w) => w.code === site.code)!
    const own = bins.filter((b) => b.warehouseId === wh.id)
    return {
      id: wh.id,
      code: wh.code,
      storageBins: own.filter((b) => b.kind === 'storage').map((b) => b.id),
      receivingBin: own.find((b) => b.code === RECEIVING_BIN_CODE)!.id,
      transitBin: own.find((b) => b.code === TRANSIT_BIN_CODE)!.id,
    }
  })
}

async function nextId(em: EntityManager, table: string): Promise<number> {
  const [row] = await em.query(`SELECT COALESCE(MAX(id), 0) + 1 AS next FROM ${table}`)
  return Number(row.next)
}

async function writeHistory(em: EntityManager, history: DemoHistory, plans: readonly StockPlan[]): Promise<void> {
  await bulkInsert(em, 'lots', ['id', 'item_id', 'code', 'received_at', 'vendor_id', 'tint_note', 'created_at'],
    history.lots.rows.map((l) => [l.id, l.itemId, l.code, l.receivedAt, l.vendorId, l.tintNote, `${l.receivedAt} 08:00:00`]))
  await bulkInsert(em, 'transfers', ['id', 'from_warehouse_id', 'to_warehouse_id', 'status', 'note', 'shipped_by', 'shipped_at', 'received_by', 'received_at'],
    history.transfers.rows.map((t) => [t.id, t.fromWarehouseId, t.toWarehouseId, t.status, t.note, t.shippedBy, t.shippedAt, t.receivedBy, t.receivedAt]))
  await bulkInsert(em, 'transfer_lines', ['id', 'transfer_id', 'item_id', 'lot_id', 'from_bin_id', 'qty', 'received_qty'],
    history.transfers.lines.map((l) => [l.id, l.transferId, l.itemId, l.lotId, l.fromBinId, l.qty, l.receivedQty]))
  await bulkInsert(em, 'stock_moves',
    ['at', 'move_type', 'item_id', 'warehouse_id', 'bin_id', 'lot_id', 'qty', 'unit_cost', 'doc_type', 'doc_id', 'doc_line_id', 'reason', 'note', 'batch_id', 'user_id'],
    history.ledger.moves.map((m) => [m.at, m.moveType, m.itemId, m.warehouseId, m.binId, m.lotId, m.qty, m.unitCost, m.docType, m.docId, m.docLineId, m.reason, m.note, m.batchId, m.userId]))
  await bulkInsert(em, 'stock_balances', ['item_id', 'warehouse_id', 'bin_id', 'lot_id', 'on_hand', 'reserved'],
    [...history.ledger.balances.values()].map((b) => [b.itemId, b.warehouseId, b.binId, b.lotId, b.onHand, 0]))
  // Every stocked pair gets its moving average; most also get a manual minimum (the low-stock flag).
  const minimums = new Map(plans.map((p, i) => [`${p.item.id}|${p.warehouse.id}`, i % 5 === 4 ? null : p.reorderPoint]))
  await bulkInsert(em, 'item_warehouses', ['item_id', 'warehouse_id', 'avg_cost', 'min_qty'],
    [...history.ledger.averagesByPair().entries()].map(([key, avg]) => [...key.split('|').map(Number), avg, minimums.get(key) ?? null]))
}

export async function loadDemoStock(em: EntityManager, now = new Date()): Promise<void> {
  const warehouses = await planWarehouses(em)
  if (!warehouses) return // the warehouse step did not run
  const [moved] = await em.query('SELECT COUNT(*) AS n FROM stock_moves WHERE warehouse_id IN (?)', [warehouses.map((w) => w.id)])
  if (Number(moved.n) > 0) return
  const plans = planStock(await planItems(em), warehouses)
  const users = await em.findBy(User, { username: In(['counter', 'warehouse']) })
  const history = new DemoHistory({
    plans,
    users: { counter: users.find((u) => u.username === 'counter')?.id ?? null, warehouse: users.find((u) => u.username === 'warehouse')?.id ?? null },
    now,
    seed: DEMO_SEED,
    ids: { lot: await nextId(em, 'lots'), transfer: await nextId(em, 'transfers'), transferLine: await nextId(em, 'transfer_lines') },
  })
  history.run()
  await writeHistory(em, history, plans)
}
