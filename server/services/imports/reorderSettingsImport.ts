// What reorder points are worked out from, brought in so a new Lumenyard suggests what the old one did:
// the reorder settings by layer (the whole business, a family, an ABC class, an item in a warehouse) in the
// columns of reorder-settings.xlsx, and lead times seen before (one row per vendor, item and order, days from
// sending the order to its first receipt of the item) in the columns of lead-times.xlsx.
import { ITEM_FAMILIES } from '../../../shared/catalog.js'
import { problem } from '../../../shared/errors/errorCodes.js'
import { policyUpsertSchema, type PolicyUpsertInput } from '../../../shared/schemas/reorder.js'
import { DAY_SECONDS, observedLeadTimeSql } from '../reorder/leadTimes.js'
import type { CellValue, ImportSpec } from './importTypes.js'
import { cellText, distinctOf, inChunks, itemsBySku, marks, namedItem, namedWarehouse, notOwn, type ItemFacts, type WarehouseFacts, warehousesByCode } from './importFacts.js'
import { firstTimeIds, insertRows, recordsImport } from './recordsImport.js'

export const REORDER_SETTINGS_SPEC: ImportSpec = {
  columns: [
    { key: 'scope', header: 'Applies to', aliases: ['Scope'], required: true, kind: 'text' },
    { key: 'family', header: 'Family', kind: 'text' },
    { key: 'abcClass', header: 'ABC class', kind: 'text' },
    { key: 'sku', header: 'SKU', kind: 'text' },
    { key: 'warehouse', header: 'Warehouse', kind: 'text' },
    { key: 'serviceLevel', header: 'Service level', kind: 'decimal' },
    { key: 'reviewPeriodDays', header: 'Review days', kind: 'integer' },
    { key: 'costPerOrder', header: 'Cost per order', kind: 'decimal' },
    { key: 'holdingRatePerYear', header: 'Holding rate', kind: 'decimal' },
    { key: 'method', header: 'Method', kind: 'text' },
    { key: 'soonDays', header: 'Soon days', kind: 'integer' },
    { key: 'overstockMarginDays', header: 'Overstock margin days', kind: 'integer' },
    { key: 'deadStockDays', header: 'Dead stock days', kind: 'integer' },
    { key: 'usageWindowDays', header: 'Usage window days', kind: 'integer' },
    { key: 'abcCutoffA', header: 'ABC cut A', kind: 'decimal' },
    { key: 'abcCutoffB', header: 'ABC cut B', kind: 'decimal' },
    { key: 'overrideReorderPoint', header: 'Reorder point set by hand', kind: 'integer' },
    { key: 'overrideOrderQty', header: 'Order quantity set by hand', kind: 'integer' },
    { key: 'overrideReason', header: 'Why set by hand', kind: 'text' },
    { key: 'note', header: 'Note', kind: 'text' },
  ],
  maxRows: 20_000,
  maxColumns: 30,
}

export const REORDER_SETTINGS_GUIDE: Record<string, string> = {
  scope: 'global (the whole business), family, abc (an ABC class) or item_warehouse (one item in one warehouse). One row per target; a target already set in Lumenyard is refused.',
  family: `For family rows: ${ITEM_FAMILIES.join(', ')}.`,
  abcClass: 'For abc rows: A, B or C.',
  sku: 'For item_warehouse rows: the item.',
  warehouse: 'For item_warehouse rows: the warehouse code.',
  serviceLevel: 'The chance of not running out during a lead time, 0.5 to 0.999 (blank: taken from the layer above).',
  reviewPeriodDays: 'Days between reviews, 1 to 365.',
  costPerOrder: 'What placing one order costs, up to 2 decimals.',
  holdingRatePerYear: 'Yearly cost of holding stock as a share of its value, 0 to 2 (0.25 = 25 %).',
  method: 'eoq (economic order quantity) or orderUpTo (order up to a level).',
  soonDays: 'Days ahead counted as soon.',
  overstockMarginDays: 'Days of stock beyond which it is too much.',
  deadStockDays: 'Days without use before stock counts as dead.',
  usageWindowDays: 'global rows only: days of use the statistics read.',
  abcCutoffA: 'global rows only: the share of usage value that ends class A, 0 to 1.',
  abcCutoffB: 'global rows only: the share that ends class B.',
  overrideReorderPoint: 'item_warehouse rows only: a reorder point typed in (give the reason).',
  overrideOrderQty: 'item_warehouse rows only: an order quantity typed in (give the reason).',
  overrideReason: 'Why a figure is set by hand.',
  note: 'A note.',
}

type SettingWrite = PolicyUpsertInput & { scopeKey: string; target: string }
interface SettingFacts { items: Map<string, ItemFacts>; warehouses: Map<string, WarehouseFacts> }

const decimal = (v: CellValue | undefined) => (v === null || v === undefined ? null : Number(v))
const blankNull = (v: CellValue | undefined) => (v === undefined || v === '' ? null : v)

export const reorderSettingsImport = recordsImport<SettingWrite, SettingFacts>({
  kind: 'reorder_settings',
  spec: REORDER_SETTINGS_SPEC,
  async facts(em, part, importId) {
    const items = await itemsBySku(em, distinctOf(part, 'sku'))
    const [own, ownId] = notOwn('p.import_id', importId)
    // The layers above an item (a handful) whole; an item's own settings only for the items these rows name.
    const target = `CASE p.scope WHEN 'global' THEN 'global' WHEN 'family' THEN CONCAT('family ', p.family) WHEN 'abc' THEN CONCAT('abc ', p.abc_class)
         ELSE CONCAT(i.sku, ' ', w.code) END AS target FROM reorder_policies p LEFT JOIN items i ON i.id = p.item_id LEFT JOIN warehouses w ON w.id = p.warehouse_id`
    const held: { target: string }[] = [
      ...(await em.query(`SELECT ${target} WHERE p.scope <> 'item_warehouse'${own}`, [ownId]) as { target: string }[]),
      ...(await inChunks([...items.values()].map((i) => i.id), (c) => em.query(
        `SELECT ${target} WHERE p.scope = 'item_warehouse' AND p.item_id IN (${marks(c.length)})${own}`, [...c, ownId]) as Promise<{ target: string }[]>)),
    ]
    return { items, warehouses: await warehousesByCode(em), held: new Set(held.map((h) => h.target.toUpperCase())) }
  },
  read(values, facts, reader) {
    const scope = cellText(values.scope).toLowerCase()
    const { sku, item } = namedItem(values.sku, facts.items, reader)
    const { whCode, warehouse } = namedWarehouse(values.warehouse, facts.warehouses, reader)
    const parsed = policyUpsertSchema.safeParse({
      scope,
      family: cellText(values.family).toLowerCase() || undefined,
      abcClass: cellText(values.abcClass).toUpperCase() || undefined,
      itemId: sku ? (item?.id ?? 1) : undefined,
      warehouseId: whCode ? (warehouse?.id ?? 1) : undefined,
      serviceLevel: decimal(values.serviceLevel), reviewPeriodDays: blankNull(values.reviewPeriodDays),
      costPerOrder: blankNull(values.costPerOrder), holdingRatePerYear: decimal(values.holdingRatePerYear),
      method: blankNull(values.method), soonDays: blankNull(values.soonDays), overstockMarginDays: blankNull(values.overstockMarginDays),
      deadStockDays: blankNull(values.deadStockDays), usageWindowDays: blankNull(values.usageWindowDays),
      abcCutoffA: decimal(values.abcCutoffA), abcCutoffB: decimal(values.abcCutoffB),
      overrideReorderPoint: blankNull(values.overrideReorderPoint), overrideOrderQty: blankNull(values.overrideOrderQty),
      overrideReason: blankNull(values.overrideReason), note: blankNull(values.note),
    })
    if (!parsed.success) {
      reader.issues(parsed.error.issues, { itemId: 'sku', warehouseId: 'warehouse' })
      return null
    }
    const p = parsed.data
    if (p.scope === 'item_warehouse' && (!item || !warehouse)) return null
    const scopeKey = p.scope === 'family' ? p.family! : p.scope === 'abc' ? p.abcClass! : p.scope === 'item_warehouse' ? `${item!.id}:${warehouse!.id}` : ''
    const target = p.scope === 'global' ? 'global' : p.scope === 'family' ? `family ${p.family}` : p.scope === 'abc' ? `abc ${p.abcClass}` : `${item!.sku} ${warehouse!.code}`
    // Only the fields of its own scope are kept (a family row names no item even when the sheet does).
    return { ...p, family: p.scope === 'family' ? p.family : undefined, abcClass: p.scope === 'abc' ? p.abcClass : undefined,
      itemId: p.scope === 'item_warehouse' ? item!.id : undefined, warehouseId: p.scope === 'item_warehouse' ? warehouse!.id : undefined, scopeKey, target }
  },
  identity: (s) => s.target,
  identityColumn: 'scope',
  preview: (s, values) => ({ label: s?.target ?? (cellText(values.scope) || null), place: null }),
  async insert(em, importId, rows) {
    await insertRows(em, 'reorder_policies', ['scope', 'scope_key', 'family', 'abc_class', 'item_id', 'warehouse_id', 'service_level', 'review_period_days',
      'cost_per_order', 'holding_rate', 'method', 'soon_days', 'overstock_margin_days', 'dead_stock_days', 'usage_window_days', 'abc_cutoff_a', 'abc_cutoff_b',
      'override_reorder_point', 'override_order_qty', 'override_reason', 'note'], importId, rows, (s) => [
      s.scope, s.scopeKey, s.family ?? null, s.abcClass ?? null, s.itemId ?? null, s.warehouseId ?? null, s.serviceLevel ?? null, s.reviewPeriodDays ?? null,
      s.costPerOrder ?? null, s.holdingRatePerYear ?? null, s.method ?? null, s.soonDays ?? null, s.overstockMarginDays ?? null, s.deadStockDays ?? null,
      s.usageWindowDays ?? null, s.abcCutoffA ?? null, s.abcCutoffB ?? null, s.overrideReorderPoint ?? null, s.overrideOrderQty ?? null, s.overrideReason ?? null, s.note ?? null])
    return { settings: rows.length }
  },
  async inUse(em, importId) {
    // A layer changed on the reorder screen since the import belongs to that change now.
    const [changed]: { scope: string; scope_key: string }[] = await em.query(
      `SELECT p.scope, p.scope_key FROM reorder_policies p JOIN data_imports d ON d.id = p.import_id
        WHERE p.import_id = ? AND p.updated_at > d.created_at + INTERVAL 1 SECOND LIMIT 1`, [importId])
    return changed ? `${changed.scope} ${changed.scope_key}`.trim() : null
  },
  remove: (em, importId) => em.query('DELETE FROM reorder_policies WHERE import_id = ?', [importId]),
})

export const LEAD_TIMES_SPEC: ImportSpec = {
  columns: [
    { key: 'vendor', header: 'Vendor code', aliases: ['Vendor'], required: true, kind: 'text' },
    { key: 'sku', header: 'SKU', required: true, kind: 'text' },
    { key: 'order', header: 'Order number', aliases: ['Order', 'Purchase order'], required: true, kind: 'text' },
    { key: 'days', header: 'Lead time days', aliases: ['Days'], required: true, kind: 'decimal' },
  ],
  maxRows: 50_000,
  maxColumns: 20,
}

export const LEAD_TIMES_GUIDE: Record<string, string> = {
  vendor: 'A vendor already in Lumenyard.',
  sku: 'An item already in the catalog.',
  order: 'The purchase order it came on (up to 40 characters); one row per vendor, item and order.',
  days: 'Days from sending the order to the first arrival of the item, 0 to 3650 (fractions of a day allowed).',
}

interface LeadTimeWrite { vendorId: number; vendor: string; itemId: number; sku: string; order: string; seconds: number }
interface LeadTimeFacts { items: Map<string, ItemFacts>; vendors: Map<string, { id: number; code: string }> }

export const leadTimesImport = recordsImport<LeadTimeWrite, LeadTimeFacts>({
  kind: 'lead_times',
  spec: LEAD_TIMES_SPEC,
  async facts(em, part, importId) {
    const vendors = await inChunks(distinctOf(part, 'vendor'), (c) => em.query(`SELECT id, code FROM vendors WHERE code IN (${marks(c.length)})`, c) as Promise<{ id: number; code: string }[]>)
    const items = await itemsBySku(em, distinctOf(part, 'sku'))
    // Held: the lead times already seen of these rows' items, from this ledger's receipts or an earlier import.
    const [own, ownId] = notOwn('h.import_id', importId)
    const seen = await inChunks([...items.values()].map((i) => i.id), (c) => em.query(
      `SELECT v.code AS vendor, i.sku, t.order_ref FROM (${observedLeadTimeSql(`AND $item IN (${marks(c.length)})`, own)}) t
         JOIN vendors v ON v.id = t.vendor_id JOIN items i ON i.id = t.item_id`, [...c, ...c, ownId]) as Promise<{ vendor: string; sku: string; order_ref: string }[]>)
    return {
      items,
      vendors: new Map(vendors.map((v) => [v.code.toUpperCase(), v])),
      held: new Set(seen.map((s) => `${s.vendor} ${s.sku} ${s.order_ref}`.toUpperCase())),
    }
  },
  read(values, facts, reader) {
    const code = cellText(values.vendor)
    const vendor = code ? facts.vendors.get(code.toUpperCase()) : undefined
    if (code && !vendor) reader.add('vendor', problem('import_vendor_unknown', { vendor: code }))
    const { item } = namedItem(values.sku, facts.items, reader)
    const order = cellText(values.order)
    if (order.length > 40) reader.add('order', problem('too_long', { max: 40 }))
    const days = values.days === null || values.days === undefined ? null : Number(values.days)
    if (days !== null && days < 0) reader.add('days', problem('at_least', { min: 0 }))
    if (days !== null && days > 3650) reader.add('days', problem('at_most', { max: 3650 }))
    if (!vendor || !item || !order || order.length > 40 || days === null || days < 0 || days > 3650) return null
    return { vendorId: vendor.id, vendor: vendor.code, itemId: item.id, sku: item.sku, order, seconds: Math.round(days * DAY_SECONDS) }
  },
  identity: (t) => `${t.vendor} ${t.sku} ${t.order}`,
  identityColumn: 'order',
  preview: (t, values) => ({ label: t?.sku ?? (cellText(values.sku) || null), place: t ? `${t.vendor} ${t.order}` : null }),
  async insert(em, importId, rows) {
    const items = await firstTimeIds(em, 'lead_time_history', 'item_id', importId, rows.map((t) => t.itemId))
    await insertRows(em, 'lead_time_history', ['vendor_id', 'item_id', 'order_ref', 'seconds'], importId, rows, (t) => [t.vendorId, t.itemId, t.order, t.seconds])
    return { leadTimes: rows.length, items }
  },
  inUse: async () => null,
  remove: (em, importId) => em.query('DELETE FROM lead_time_history WHERE import_id = ?', [importId]),
})
